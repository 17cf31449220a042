import { useEffect, useState } from 'preact/hooks';
import { applyLabRows, checkLabRows, guessMapping, type LabMapping, type LabRowCheck } from '../../exchange/lab-import';
import { parseCsv } from '../../exchange/csv';
import { getDb } from '../../store/connection';
import { SelectField } from '../components/Field';
import { useSettings } from '../data';
import { onLaunchedFile } from '../launch';

const FIELDS: Array<{ key: keyof LabMapping; label: string; required: boolean }> = [
  { key: 'sampleId', label: 'Sample ID column', required: true },
  { key: 'parameter', label: 'Parameter column', required: true },
  { key: 'value', label: 'Value column', required: true },
  { key: 'unit', label: 'Unit column', required: true },
  { key: 'qualifier', label: 'Qualifier column', required: false },
  { key: 'labSampleId', label: 'Lab sample ID column', required: false },
];

/** Pick a lab CSV, map its columns, preview with errors per row, then store as lab values. */
export function LabImport() {
  const settings = useSettings();
  const [text, setText] = useState('');
  const [header, setHeader] = useState<string[]>([]);
  const [mapping, setMapping] = useState<Partial<LabMapping>>({});
  const [rows, setRows] = useState<LabRowCheck[]>([]);
  const [fileErrors, setFileErrors] = useState<string[]>([]);
  const [msg, setMsg] = useState('');

  const preview = async (m: Partial<LabMapping>, t = text) => {
    if (!FIELDS.every((f) => !f.required || m[f.key])) return setRows([]);
    const ids = new Set((await (await getDb()).getAllKeys('samples')) as string[]);
    const r = checkLabRows(t, m as LabMapping, ids);
    setRows(r.rows);
    setFileErrors(r.fileErrors);
  };

  const [fileName, setFileName] = useState('');
  const load = async (f: File) => {
    const t = await f.text();
    const h = parseCsv(t).header;
    const m = guessMapping(h);
    setText(t); setHeader(h); setMapping(m); setMsg(''); setFileName(f.name);
    await preview(m, t);
  };
  // a CSV opened with the installed app (manifest file_handlers) lands here
  useEffect(() => onLaunchedFile((f) => void load(f)), []);

  return (
    <div>
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
          <p class="lead" role="status">{rows.filter((r) => r.errors.length === 0).length} of {rows.length} rows ready</p>
          <ul class="cards row-cards" aria-label="Lab rows to import">
            {rows.slice(0, 30).map((r) => (
              <li key={r.row} class={r.errors.length ? 'card bad-row' : 'card'}>
                <span class="card-title">Row {r.row} · {r.parameter} {r.value ?? ''} {r.unit}</span>
                <span class="muted">Sample {r.sampleId}</span>
                <span class={r.errors.length ? 'field-error' : 'stable yes'}>{r.errors.join('; ') || 'Ready'}</span>
              </li>
            ))}
          </ul>
          {rows.length > 30 && <p class="muted">… and {rows.length - 30} more rows.</p>}
          <button type="button" class="btn btn-primary" onClick={async () => {
            const r = await applyLabRows(rows, settings.operator || 'office import');
            setMsg(`Stored ${r.values} lab values on ${r.samples} samples; ${r.skipped} rows skipped. Field values were not changed.`);
          }}>Store as lab values</button>
        </>
      )}
      {msg && <p class="notice" role="status">{msg}</p>}
    </div>
  );
}
