import { useEffect, useState } from 'preact/hooks';
import { applyLabRows, checkLabRows, guessMapping, sampleLabels, type LabMapping, type LabRowCheck } from '../../exchange/lab-import';
import { parseCsv } from '../../exchange/csv';
import { getDb } from '../../store/connection';
import { SelectField } from '../components/Field';
import { useSettings } from '../data';
import { onLaunchedFile } from '../launch';

const FIELDS: Array<{ key: keyof LabMapping; label: string; required: boolean }> = [
  { key: 'sampleId', label: 'Client sample ID column', required: true },
  { key: 'parameter', label: 'Parameter column', required: true },
  { key: 'value', label: 'Value column', required: true },
  { key: 'unit', label: 'Unit column', required: true },
  { key: 'qualifier', label: 'Qualifier column', required: false },
  { key: 'detectionLimit', label: 'Detection limit column', required: false },
  { key: 'labSampleId', label: 'Lab sample ID column', required: false },
  { key: 'method', label: 'Method column', required: false },
];

const shown = (r: LabRowCheck) =>
  r.censored ? `not detected${r.detectionLimit !== undefined ? ` (< ${r.detectionLimit})` : ''} ${r.unit}` : `${r.value ?? ''} ${r.unit}`;

/** Pick a lab CSV, map its columns, preview every row with its problems, then store the file at once. */
export function LabImport() {
  const settings = useSettings();
  const [text, setText] = useState('');
  const [header, setHeader] = useState<string[]>([]);
  const [mapping, setMapping] = useState<Partial<LabMapping>>({});
  const [rows, setRows] = useState<LabRowCheck[]>([]);
  const [fileErrors, setFileErrors] = useState<string[]>([]);
  const [msg, setMsg] = useState('');
  const [err, setErr] = useState('');
  const [fileName, setFileName] = useState('');

  const samples = async () => sampleLabels(await (await getDb()).getAll('samples'));
  const preview = async (m: Partial<LabMapping>, t = text) => {
    if (!FIELDS.every((f) => !f.required || m[f.key])) return setRows([]);
    const r = checkLabRows(t, m as LabMapping, await samples());
    setRows(r.rows);
    setFileErrors(r.fileErrors);
  };
  const load = async (f: File) => {
    const t = await f.text();
    const parsed = parseCsv(t);
    const m = guessMapping(parsed.header, parsed.rows.slice(0, 200), new Set((await samples()).keys()));
    setText(t); setHeader(parsed.header); setMapping(m); setMsg(''); setErr(''); setFileName(f.name);
    await preview(m, t);
  };
  // a CSV opened with the installed app (manifest file_handlers) lands here
  useEffect(() => onLaunchedFile((f) => void load(f)), []);

  const ready = rows.filter((r) => r.errors.length === 0);
  const problems = rows.filter((r) => r.errors.length > 0);
  return (
    <div>
      <p class="muted">Values are stored beside the field values, never over them. Major ions from the lab fill what the field did not measure, so ionic strength comes from the full composition and the charge balance is checked.</p>
      <div class="field">
        <label for="labfile">Lab results file (CSV)</label>
        <input id="labfile" type="file" accept=".csv,text/csv" onChange={async (e) => {
          const f = (e.currentTarget as HTMLInputElement).files?.[0];
          if (f) await load(f);
        }} />
        {fileName && <p class="muted">File: {fileName}</p>}
      </div>
      {header.length > 0 && (
        <div class="row2">
          {FIELDS.map((f) => (
            <SelectField key={f.key} id={`map-${f.key}`} label={f.label} value={mapping[f.key] ?? ''} onChange={(v) => { const m = { ...mapping, [f.key]: v || undefined }; setMapping(m); void preview(m); }}>
              <option value="">{f.required ? 'Choose…' : '(none)'}</option>
              {header.map((h) => <option key={h} value={h}>{h}</option>)}
            </SelectField>
          ))}
        </div>
      )}
      {fileErrors.map((e) => <p key={e} class="field-error">{e}</p>)}
      {rows.length > 0 && (
        <>
          <p class="lead" role="status">{ready.length} of {rows.length} rows ready{problems.length > 0 ? `; ${problems.length} with problems (listed first)` : ''}</p>
          <ul class="cards row-cards" aria-label="Lab rows to import">
            {[...problems, ...ready].slice(0, 50).map((r) => (
              <li key={r.row} class={r.errors.length ? 'card bad-row' : 'card'}>
                <span class="card-title">Row {r.row} · {r.parameter} {shown(r)}</span>
                <span class="muted">Sample {r.label}</span>
                <span class={r.errors.length ? 'field-error' : 'stable yes'}>{r.errors.join('; ') || 'Ready'}</span>
              </li>
            ))}
          </ul>
          {rows.length > 50 && <p class="muted">Showing 50 of {rows.length} rows.</p>}
          <button type="button" class="btn btn-primary" disabled={ready.length === 0} onClick={async () => {
            setErr(''); setMsg('');
            try {
              const r = await applyLabRows(rows, settings.operator || 'lab import');
              setMsg(`Stored ${r.values} lab values on ${r.samples} samples${r.skipped ? `; ${r.skipped} rows with problems were left out` : ''}. Field values were not changed.`);
            } catch (e) {
              setErr(`${e instanceof Error ? e.message : String(e)} Nothing from this file was stored.`);
            }
          }}>{problems.length > 0 ? `Store the ${ready.length} ready rows (leave out ${problems.length})` : `Store all ${ready.length} rows`}</button>
        </>
      )}
      {err && <p class="field-error" role="alert">{err}</p>}
      {msg && <p class="notice" role="status">{msg}</p>}
    </div>
  );
}
