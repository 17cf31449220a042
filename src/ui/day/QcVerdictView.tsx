import type { QcVerdict } from '../../chemistry';

/** A replicate's or blank's verdict: one line, then each parameter compared. */
export function QcVerdictView({ verdict }: { verdict: QcVerdict | undefined }) {
  if (!verdict) return null;
  const head =
    verdict.pass === undefined
      ? `Not judged yet: enter ${verdict.kind === 'blank' ? 'SC, alkalinity or calcium' : 'readings the parent also has'}.`
      : verdict.pass
        ? `✓ ${verdict.kind === 'blank' ? 'Blank' : 'Replicate'} passes`
        : `✗ ${verdict.kind === 'blank' ? 'Blank' : 'Replicate'} fails`;
  return (
    <div class={`qc-verdict ${verdict.pass === false ? 'fail' : verdict.pass ? 'pass' : ''}`} role="status" data-testid="qc-verdict">
      <strong>{head}</strong>
      <ul>
        {verdict.checks.map((c) => (
          <li key={c.parameter} class={c.pass ? '' : 'bad'}>{c.pass ? '✓' : '✗'} {c.message}</li>
        ))}
      </ul>
      <span class="muted">Limits from profile {verdict.profile.profileId} v{verdict.profile.profileVersion}</span>
    </div>
  );
}
