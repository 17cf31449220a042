import { useEffect, useState } from 'preact/hooks';
import { DEFAULT_PROFILE, type MethodProfile } from '../../chemistry';
import { listProfiles, saveProfile, saveSettings, toStoreError } from '../../store/records';
import { SelectField, TextField } from '../components/Field';
import { useLive, useSettings } from '../data';
import { parseDecimal } from '../forms/parse';

/** The thresholds a project most often changes, as editable fields: [label, unit, read, write]. */
const FIELDS: Array<[string, string, (p: MethodProfile) => number, (p: MethodProfile, v: number) => void]> = [
  ['pH slope minimum', '% of Nernst', (p) => p.phCalibration.slopeMinPercent, (p, v) => (p.phCalibration.slopeMinPercent = v)],
  ['pH slope maximum', '% of Nernst', (p) => p.phCalibration.slopeMaxPercent, (p, v) => (p.phCalibration.slopeMaxPercent = v)],
  ['pH offset limit at pH 7', 'mV', (p) => p.phCalibration.offsetMaxMv, (p, v) => (p.phCalibration.offsetMaxMv = v)],
  ['SC standard tolerance at ≤ 100 µS/cm', 'fraction', (p) => p.scCalibration.relAtOrBelow, (p, v) => (p.scCalibration.relAtOrBelow = v)],
  ['SC standard tolerance above', 'fraction', (p) => p.scCalibration.relAbove, (p, v) => (p.scCalibration.relAbove = v)],
  ['DO air calibration tolerance', 'mg/L', (p) => p.doCalibration.absMgL, (p, v) => (p.doCalibration.absMgL = v)],
  ['Readings needed for a stable value', 'readings', (p) => p.stabilization.readings, (p, v) => (p.stabilization.readings = v)],
  ['Stable pH within', 'pH', (p) => p.stabilization.tolerance.pH.abs ?? 0, (p, v) => (p.stabilization.tolerance.pH.abs = v)],
  ['Stable temperature within', '°C', (p) => p.stabilization.tolerance.temperature.abs ?? 0, (p, v) => (p.stabilization.tolerance.temperature.abs = v)],
  ['Stable DO within', 'mg/L', (p) => p.stabilization.tolerance.do.abs ?? 0, (p, v) => (p.stabilization.tolerance.do.abs = v)],
  ['Calibration window', 'h', (p) => p.calibrationWindowHours, (p, v) => (p.calibrationWindowHours = v)],
];

/** Choose the active method profile; copy the default into an editable, versioned project profile. */
export function ProfileEditor() {
  const settings = useSettings();
  const profiles = useLive(listProfiles, [], ['profiles']);
  const list = profiles.data ?? [DEFAULT_PROFILE];
  const active = list.find((p) => p.id === settings.profileId) ?? DEFAULT_PROFILE;
  const [raw, setRaw] = useState<string[]>([]);
  const [msg, setMsg] = useState('');
  const [err, setErr] = useState('');
  useEffect(() => setRaw(FIELDS.map(([, , read]) => String(read(active)))), [active.id, active.version]);
  const editable = active.id !== DEFAULT_PROFILE.id;
  const activate = async (id: string) => {
    await saveSettings({ ...settings, profileId: id });
    setMsg('');
  };
  return (
    <div>
      <SelectField id="profile" label="Active method profile" value={active.id} onChange={(v) => void activate(v)}>
        {list.map((p) => <option key={p.id} value={p.id}>{p.name} (v{p.version})</option>)}
      </SelectField>
      <p class="muted">{active.notes ?? ''} Every check records the profile id and version it used.</p>
      {!editable ? (
        <button type="button" class="btn" onClick={async () => {
          const copy: MethodProfile = { ...structuredClone(DEFAULT_PROFILE), id: `project-${Date.now().toString(36)}`, version: 1, name: 'Project profile (edited copy of the default)' };
          await saveProfile(copy);
          await activate(copy.id);
        }}>Make an editable copy</button>
      ) : (
        <>
          {FIELDS.map(([label, unit], i) => (
            <TextField key={label} id={`prof-${i}`} label={label} unit={unit} numeric value={raw[i] ?? ''} onInput={(v) => setRaw(raw.map((r, k) => (k === i ? v : r)))} />
          ))}
          <button type="button" class="btn btn-primary" onClick={async () => {
            setErr(''); setMsg('');
            const next = structuredClone(active);
            for (let i = 0; i < FIELDS.length; i++) {
              const p = parseDecimal(raw[i], { label: FIELDS[i]![0].toLowerCase(), required: true, min: 0 });
              if (!p.ok || p.value === undefined) return setErr(p.ok ? 'Fill every field.' : p.error);
              FIELDS[i]![3](next, p.value);
            }
            next.version = active.version + 1;
            try {
              await saveProfile(next);
              setMsg(`Saved as version ${next.version}. Earlier records keep the version they were checked with.`);
            } catch (e) {
              setErr(toStoreError(e).message);
            }
          }}>Save as a new version</button>
        </>
      )}
      {err && <p class="field-error" role="alert">{err}</p>}
      {msg && <p class="notice" role="status">{msg}</p>}
    </div>
  );
}
