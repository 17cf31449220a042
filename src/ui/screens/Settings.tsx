import { useEffect, useState } from 'preact/hooks';
import { ProfileEditor } from './ProfileEditor';
import { loadDemo, removeDemo } from '../../demo/load';
import type { Settings } from '../../records/schema';
import { createBackup, restoreBackup, BackupError } from '../../store/backup';
import { saveSettings, toStoreError } from '../../store/records';
import { formatBytes, requestPersistence, type StorageStatus } from '../../store/storage';
import { SelectField, TextField } from '../components/Field';
import { useSettings } from '../data';
import { downloadText } from '../../exchange/share';
import { parseDecimal } from '../forms/parse';

export function SettingsScreen() {
  const current = useSettings();
  const [s, setS] = useState<Settings>(current);
  const [factor, setFactor] = useState(String(current.conductanceFactor));
  const [msg, setMsg] = useState('');
  const [err, setErr] = useState('');
  const [storage, setStorage] = useState<StorageStatus | null>(null);
  useEffect(() => {
    setS(current);
    setFactor(String(current.conductanceFactor));
  }, [current]);
  useEffect(() => {
    void requestPersistence().then(setStorage);
  }, []);
  const f = parseDecimal(factor, { label: 'conductance factor', min: 5e-6, max: 3e-5 });

  const save = async () => {
    setErr('');
    if (!f.ok || f.value === undefined) return setErr(f.ok ? 'Enter the conductance factor.' : f.error);
    if ((s.projectId ?? '').length > 35) return setErr('The WQX project ID holds at most 35 characters.');
    try {
      await saveSettings({ ...s, conductanceFactor: f.value });
      setMsg('Settings saved.');
    } catch (e) {
      setErr(toStoreError(e).message);
    }
  };

  return (
    <section>
      <TextField id="operator" label="Your name (recorded with each change)" value={s.operator} onInput={(v) => setS({ ...s, operator: v })} />
      <SelectField id="model" label="Activity model" value={s.activityModel} onChange={(v) => setS({ ...s, activityModel: v as Settings['activityModel'] })}>
        <option value="auto">Automatic by ionic strength (recommended)</option>
        <option value="debye-huckel">Debye–Hückel limiting law (I ≤ 0.005)</option>
        <option value="extended-debye-huckel">Extended Debye–Hückel (I ≤ 0.1)</option>
        <option value="davies">Davies (I ≤ 0.5)</option>
        <option value="truesdell-jones">Truesdell–Jones (I ≤ 2)</option>
      </SelectField>
      <TextField id="factor" label="Ionic strength per µS/cm (SC factor)" unit="mol/L per µS/cm" numeric value={factor} onInput={setFactor} error={f.ok ? undefined : f.error} hint="Default 1.5e-5, from 762 real analyses; Na–Cl waters run nearer 1.2e-5." />
      <SelectField id="alkUnit" label="Usual alkalinity unit" value={s.units.alkalinity} onChange={(v) => setS({ ...s, units: { ...s.units, alkalinity: v as Settings['units']['alkalinity'] } })}>
        <option value="mg/L CaCO3">mg/L as CaCO₃</option><option value="meq/L">meq/L</option><option value="mg/L HCO3">mg/L as HCO₃</option>
      </SelectField>
      <SelectField id="condUnitSetting" label="Usual conductance unit" value={s.units.conductance} onChange={(v) => setS({ ...s, units: { ...s.units, conductance: v as Settings['units']['conductance'] } })}>
        <option value="uS/cm">µS/cm</option><option value="mS/cm">mS/cm</option>
      </SelectField>
      <SelectField id="doUnitSetting" label="Usual dissolved oxygen unit" value={s.units.do} onChange={(v) => setS({ ...s, units: { ...s.units, do: v as Settings['units']['do'] } })}>
        <option value="mg/L">mg/L</option><option value="%">% saturation</option>
      </SelectField>
      <SelectField id="pUnit" label="Usual pressure unit" value={s.units.pressure} onChange={(v) => setS({ ...s, units: { ...s.units, pressure: v as Settings['units']['pressure'] } })}>
        <option value="hPa">hPa</option><option value="kPa">kPa</option><option value="mmHg">mmHg</option>
      </SelectField>
      <h2>Office</h2>
      <TextField id="projectId" label="WQX project ID" value={s.projectId ?? ''} onInput={(v) => setS({ ...s, projectId: v })} error={(s.projectId ?? '').length > 35 ? 'At most 35 characters (WQX).' : undefined} hint="Written in the samples CSV and required by the WQX export." />
      <TextField id="organizationId" label="WQX organization ID" value={s.organizationId ?? ''} onInput={(v) => setS({ ...s, organizationId: v })} hint="Your organization's ID in WQX, written in the exports." />
      <TextField
        id="endpoint"
        label="Office upload address (HTTPS)"
        type="url"
        value={s.office.endpoint}
        onInput={(v) => setS({ ...s, office: { ...s.office, endpoint: v } })}
        error={/^http:\/\/(?!(localhost|127\.0\.0\.1)[:/])/i.test(s.office.endpoint) ? 'This address is not encrypted (http): records and the token would cross the network readable. Use https.' : undefined}
      />
      <SelectField id="method" label="How the office receives" value={s.office.method} onChange={(v) => setS({ ...s, office: { ...s.office, method: v as Settings['office']['method'] } })}>
        <option value="POST">Office web address (POST with a batch key)</option>
        <option value="PUT">Storage link, pre-signed (PUT; put {'{key}'} where the file name goes)</option>
      </SelectField>
      <TextField id="token" label="Access token (optional)" type="password" value={s.office.token} onInput={(v) => setS({ ...s, office: { ...s.office, token: v } })} />
      {err && <p class="field-error" role="alert">{err}</p>}
      {msg && <p class="notice" role="status">{msg}</p>}
      <button type="button" class="btn btn-primary btn-block" onClick={save}>Save settings</button>

      <h2>Method profile</h2>
      <ProfileEditor />

      <h2>Storage on this phone</h2>
      <p data-testid="storage-status">
        {storage === null ? 'Checking…' : storage.persisted === 'unsupported' ? 'This browser cannot promise to keep the data: send days to the office and keep backups.' : storage.persisted ? 'The browser has agreed to keep Bankside’s data.' : 'The browser may clear Bankside’s data when space runs low or after weeks unused: send days to the office and keep backups.'}
        {storage && storage.usageBytes !== undefined && ` Using ${formatBytes(storage.usageBytes)} of ${formatBytes(storage.quotaBytes)}.`}
      </p>
      <button type="button" class="btn btn-block" onClick={async () => {
        const b = await createBackup();
        downloadText(`bankside-backup-${new Date().toISOString().slice(0, 10)}.json`, JSON.stringify(b), 'application/json');
      }}>Download a full backup</button>
      <div class="field">
        <label for="restore">Restore from a backup file</label>
        <input id="restore" type="file" accept="application/json,.json" onChange={async (e) => {
          const file = (e.currentTarget as HTMLInputElement).files?.[0];
          if (!file) return;
          setErr(''); setMsg('');
          try {
            const r = await restoreBackup(await file.text());
            setMsg(`Restored: ${r.added} added, ${r.updated} updated, ${r.unchanged} already here.`);
          } catch (x) {
            setErr(x instanceof BackupError ? `${x.message}${x.problems.length ? ` (${x.problems.slice(0, 3).join('; ')})` : ''}` : toStoreError(x).message);
          }
        }} />
      </div>
      <h2>Demo creek</h2>
      <p class="muted">An invented creek with three sites and three days of samples, marked “demo”.</p>
      <div class="row2">
        <button type="button" class="btn" onClick={async () => { await loadDemo(); setMsg('Demo creek loaded.'); }}>Load demo creek</button>
        <button type="button" class="btn" onClick={async () => { const n = await removeDemo(); setMsg(`Demo removed (${n} records).`); }}>Remove demo</button>
      </div>
    </section>
  );
}
