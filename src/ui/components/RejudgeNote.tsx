import { useState } from 'preact/hooks';
import type { MethodProfile } from '../../chemistry';
import type { Sample } from '../../records/schema';
import { rejudgeSample, toStoreError } from '../../store/records';

/**
 * A stored sample keeps the profile version it was recorded (judged) with. When the active profile
 * is another version, say so; re-judging under it is the crew's explicit choice and leaves a revision.
 */
export function RejudgeNote({ sample, judgedBy, active, by, onDone }: { sample: Sample; judgedBy: MethodProfile; active: MethodProfile; by: string; onDone: (s: Sample) => void }) {
  const [err, setErr] = useState('');
  if (sample.profileId === active.id && sample.profileVersion === active.version) return null;
  const held = judgedBy.id === sample.profileId && judgedBy.version === sample.profileVersion;
  return (
    <p class="notice" data-testid="profile-note">
      Checked under {held ? judgedBy.name : sample.profileId} v{sample.profileVersion}
      {held ? '' : ' (not on this phone: shown under the active profile)'}; the active profile is {active.name} v{active.version}.{' '}
      <button type="button" class="btn btn-small" onClick={async () => {
        setErr('');
        try {
          onDone(await rejudgeSample(sample.id, active, by));
        } catch (e) {
          setErr(toStoreError(e).message);
        }
      }}>Re-judge under v{active.version}</button>
      {err && <span class="field-error" role="alert"> {err}</span>}
    </p>
  );
}
