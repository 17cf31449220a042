import { useEffect, useMemo, useRef, useState } from 'preact/hooks';
import { deriveSample } from '../../records/derive';
import { isoWithOffset } from '../../records/time';
import type { Sample } from '../../records/schema';
import { setBeforeClose } from '../../store/connection';
import {
  deleteDraft,
  deleteSample,
  getDraft,
  getSample,
  history,
  listSites,
  loadSchemas,
  putDraft,
  restoreSample,
  saveSample,
  StoreError,
  toStoreError,
} from '../../store/records';
import { Choice, Section, SelectField, TextField } from '../components/Field';
import { RepeatedReadings } from '../components/Readings';
import { ResultsPanel } from '../components/Results';
import { StateBadge } from '../components/State';
import { SampleCode } from '../components/SampleCode';
import { TitrationPlot } from '../components/TitrationPlot';
import { useLive, useProfile, useSettings } from '../data';
import { emptyForm, formFromSample, formToSample, ION_FIELDS, type SampleForm } from '../forms/sample-form';
import { go } from '../router';
import { registerDraftSaver } from '../sw-bridge';
import { downloadText } from '../../exchange/share';
import { NewSiteInline } from './Sites';

const AUTOSAVE_MS = 400;

function draftIdFor(sampleId: string | undefined): string {
  return sampleId ? `draft:sample:${sampleId}` : 'draft:sample:new';
}

/** New sample (#/new) or an existing one (#/sample/<id>). Every keystroke is saved as a draft. */
export function SampleEditor({ sampleId, siteId }: { sampleId?: string; /** a new sample's site, when the day view offered it */ siteId?: string | undefined }) {
  const settings = useSettings();
  const profile = useProfile();
  const sites = useLive(listSites, [], ['sites']);
  // A new sample's form is usable at once (no wait for storage); an existing one waits for its record.
  const [form, setForm] = useState<SampleForm | null>(() => (sampleId ? null : { ...emptyForm(), siteId: siteId ?? '' }));
  const [olderDraft, setOlderDraft] = useState<{ form: SampleForm; at: string } | null>(null);
  const [restoredAt, setRestoredAt] = useState('');
  const [saveError, setSaveError] = useState<StoreError | null>(null);
  const [missing, setMissing] = useState<string[]>([]);
  const [saving, setSaving] = useState(false);
  const [stored, setStored] = useState<Sample | undefined>(undefined);
  const draftId = draftIdFor(sampleId);
  const formRef = useRef<SampleForm | null>(null);
  const dirty = useRef(false);
  formRef.current = form;

  // Load: an unsaved draft wins over the stored record (nothing typed is lost).
  useEffect(() => {
    void loadSchemas(); // the draft's validation is ready before the first keystroke needs it
    let live = true;
    (async () => {
      const [draft, existing] = await Promise.all([getDraft(draftId), sampleId ? getSample(sampleId) : Promise.resolve(undefined)]);
      if (!live) return;
      setStored(existing);
      if (draft) {
        const restored = { ...emptyForm(), ...(draft.form as Partial<SampleForm>) } as SampleForm;
        if (dirty.current) {
          // The crew started typing before the old draft was read: keep both, under separate keys.
          await putDraft({ id: `${draftId}:${draft.updatedAt}`, kind: 'sample', form: draft.form });
          setOlderDraft({ form: restored, at: draft.updatedAt });
        } else {
          setForm(restored);
          setRestoredAt(draft.updatedAt);
        }
      } else if (existing) setForm(formFromSample(existing));
      else if (!dirty.current) setForm((f) => (f && settings.operator && !f.crew ? { ...f, crew: settings.operator } : f));
    })().catch(() => live && setForm(emptyForm()));
    return () => {
      live = false;
    };
  }, [draftId]);

  // Saves are chained: whoever asks for a flush (a timer, the page hiding, an app update, another
  // tab's upgrade) waits for any save already under way, so nothing closes the db mid-save.
  const chain = useRef<Promise<void>>(Promise.resolve());
  const flush = (): Promise<void> => {
    chain.current = chain.current.catch(() => undefined).then(async () => {
      if (!dirty.current || !formRef.current) return;
      dirty.current = false;
      try {
        await putDraft({ id: draftId, kind: 'sample', ...(sampleId ? { targetId: sampleId } : {}), form: formRef.current as unknown as Record<string, unknown> });
      } catch (e) {
        dirty.current = true;
        throw e;
      }
    });
    return chain.current;
  };

  // Debounced autosave on every change, and an immediate save when the page hides or updates.
  useEffect(() => {
    if (!form || !dirty.current) return;
    const t = setTimeout(() => {
      flush().catch((e) => setSaveError(toStoreError(e)));
    }, AUTOSAVE_MS);
    return () => clearTimeout(t);
  }, [form]);
  useEffect(() => {
    const onHide = () => void flush().catch(() => undefined);
    addEventListener('pagehide', onHide);
    document.addEventListener('visibilitychange', onHide);
    const unSw = registerDraftSaver(flush);
    setBeforeClose(flush);
    return () => {
      removeEventListener('pagehide', onHide);
      document.removeEventListener('visibilitychange', onHide);
      unSw();
      setBeforeClose(null);
      void flush().catch(() => undefined);
    };
  }, [draftId]);

  const update = (patch: Partial<SampleForm>) => {
    dirty.current = true;
    setForm((f) => (f ? { ...f, ...patch } : f));
  };

  const parsed = useMemo(() => (form ? formToSample(form) : null), [form]);
  // formToSample fills every default the derivation reads (kits, ions, alpha), so no schema pass is needed here.
  const derived = useMemo(() => (parsed ? deriveSample({ field: parsed.record.field as Sample['field'], pressure: parsed.record.pressure, lab: stored?.lab ?? [] }, settings, profile) : null), [parsed, settings, stored, profile]);

  if (!form || !parsed || !derived) return <p class="muted">Opening…</p>;
  const e = parsed.errors;

  const save = async () => {
    setSaveError(null);
    const need = [...parsed.missing];
    if (Object.keys(e).length > 0) need.push('corrections to the fields marked in red');
    setMissing(need);
    if (need.length > 0) return;
    setSaving(true);
    try {
      const rec = await saveSample({ ...parsed.record, profileId: profile.id, profileVersion: profile.version, ...(stored ? { createdAt: stored.createdAt, lab: stored.lab, instrumentIds: stored.instrumentIds, demo: stored.demo } : {}) }, settings.operator || 'field crew');
      dirty.current = false;
      await deleteDraft(draftId);
      go(`#/today?date=${rec.localDate}&saved=${rec.id}`);
    } catch (err) {
      setSaveError(toStoreError(err));
      await flush().catch(() => undefined);
    } finally {
      setSaving(false);
    }
  };

  const siteList = sites.data ?? [];
  const condUnitLabel = form.condUnit === 'mS/cm' ? 'mS/cm' : 'µS/cm';
  const st = derived.stability;
  return (
    <div class="editor">
      <div class="mini-result" aria-hidden="true">
        <StateBadge state={derived.analysis?.calciteState ?? 'unknown'} />
        {derived.analysis?.saturationIndex.calcite !== undefined && (
          <span class="mini-si">SI {derived.analysis.saturationIndex.calcite.toFixed(2)} ± {derived.analysis.calciteSiUncertainty!.toFixed(2)}</span>
        )}
      </div>
      {stored?.sampleCode && <p class="sample-code-line">Sample ID <SampleCode code={stored.sampleCode} /></p>}
      {restoredAt && (
        <p class="notice" role="status">
          Restored your unsaved entry from {new Date(restoredAt).toLocaleTimeString()}.{' '}
          <button type="button" class="linkish" onClick={async () => { await deleteDraft(draftId); setRestoredAt(''); setForm(stored ? formFromSample(stored) : emptyForm()); }}>
            Discard it
          </button>
        </p>
      )}
      {olderDraft && (
        <p class="notice" role="status">
          An unsaved entry from {new Date(olderDraft.at).toLocaleTimeString()} was also found.{' '}
          <button type="button" class="linkish" onClick={async () => { if (form) await putDraft({ id: `${draftId}:${isoWithOffset()}`, kind: 'sample', form: form as unknown as Record<string, unknown> }); dirty.current = true; setForm(olderDraft.form); setOlderDraft(null); }}>Open it instead</button>
        </p>
      )}
      {stored?.deletedAt && (
        <p class="notice warn">This sample is deleted. <button type="button" class="btn btn-small" onClick={() => restoreSample(stored.id, settings.operator || 'field crew').then(() => go('#/today'))}>Undo delete</button></p>
      )}
      <div class="editor-grid">
        <form class="editor-form" onSubmit={(ev) => { ev.preventDefault(); void save(); }} noValidate>
          <Section title="Where and when">
            <SelectField key={`site-${siteList.length}`} id="site" label="Site" value={form.siteId} onChange={(v) => update({ siteId: v })} error={missing.includes('site') ? 'Pick a site or add one here.' : undefined}>
              <option value="">Choose a site…</option>
              {siteList.map((s) => (
                <option key={s.id} value={s.id}>{s.code} · {s.name}</option>
              ))}
            </SelectField>
            <NewSiteInline onCreated={(id) => update({ siteId: id })} />
            <TextField id="time" label="Time (with UTC offset)" value={form.time} error={e.time} onInput={(v) => update({ time: v })} hint="Filled in now; edit if you are entering later." />
            <TextField id="crew" label="Crew (comma-separated)" value={form.crew} onInput={(v) => update({ crew: v })} />
            <Choice name="qc" label="Sample type" value={form.qcType} onChange={(v) => update({ qcType: v })} options={[{ value: 'environmental', label: 'Environmental' }, { value: 'replicate', label: 'Replicate' }, { value: 'blank', label: 'Blank' }]} />
            {form.qcType !== 'environmental' && (
              <TextField id="parent" label="Parent sample ID" value={form.parentId} onInput={(v) => update({ parentId: v })} hint="The environmental sample this one checks." />
            )}
          </Section>

          <Section title="Field readings">
            <RepeatedReadings id="temp" label="Water temperature" unit="°C" rows={form.temp} errors={e} errorKey="temp" stability={st.temperature} onChange={(rows) => update({ temp: rows })} />
            <Choice name="condMode" label="Conductance as read" value={form.condMode} onChange={(v) => update({ condMode: v })} options={[{ value: 'sc', label: 'SC at 25 °C' }, { value: 'ec', label: 'Raw EC' }]} />
            <Choice name="condUnit" label="Conductance unit" value={form.condUnit} onChange={(v) => update({ condUnit: v })} options={[{ value: 'uS/cm', label: 'µS/cm' }, { value: 'mS/cm', label: 'mS/cm' }]} />
            <RepeatedReadings id="cond" label={form.condMode === 'sc' ? 'Specific conductance' : 'Conductivity (raw EC)'} unit={condUnitLabel} rows={form.cond} errors={e} errorKey="cond" stability={st.sc} onChange={(rows) => update({ cond: rows })} />
            {form.condMode === 'ec' && (
              <>
                <TextField id="ecTemp" label="Temperature of the EC reading" unit="°C" numeric value={form.ecTempC} error={e.ecTempC} onInput={(v) => update({ ecTempC: v })} hint="Leave empty to use the water temperature." />
                <TextField id="alpha" label="Compensation coefficient α" unit="/°C" numeric value={form.alpha} error={e.alpha} onInput={(v) => update({ alpha: v })} />
              </>
            )}
            <RepeatedReadings id="ph" label="pH" unit="" rows={form.pH} errors={e} errorKey="pH" stability={st.pH} onChange={(rows) => update({ pH: rows })} />
            <Choice name="doUnit" label="Dissolved oxygen unit" value={form.doUnit} onChange={(v) => update({ doUnit: v })} options={[{ value: 'mg/L', label: 'mg/L' }, { value: '%', label: '% saturation' }]} />
            <RepeatedReadings id="do" label="Dissolved oxygen" unit={form.doUnit} rows={form.do} errors={e} errorKey="do" stability={st.do} onChange={(rows) => update({ do: rows })} />
            <div class="row2">
              <TextField id="pressure" label="Barometric pressure (true, at the site)" unit={form.pressureUnit} numeric value={form.pressure} error={e.pressure} onInput={(v) => update({ pressure: v })} />
              <SelectField id="pressureUnit" label="Pressure unit" value={form.pressureUnit} onChange={(v) => update({ pressureUnit: v as SampleForm['pressureUnit'] })}>
                <option value="hPa">hPa</option>
                <option value="kPa">kPa</option>
                <option value="mmHg">mmHg</option>
              </SelectField>
            </div>
          </Section>

          <Section title="Alkalinity and calcium">
            <Choice name="alkMode" label="Alkalinity" value={form.alkMode} onChange={(v) => update({ alkMode: v })} options={[{ value: 'direct', label: 'Enter result' }, { value: 'titration', label: 'Titration points' }]} />
            {form.alkMode === 'direct' ? (
              <div class="row2">
                <TextField id="alk" label="Alkalinity" unit={form.alkUnit} numeric value={form.alk} error={e.alk} onInput={(v) => update({ alk: v })} />
                <SelectField id="alkUnit" label="Alkalinity unit" value={form.alkUnit} onChange={(v) => update({ alkUnit: v as SampleForm['alkUnit'] })}>
                  <option value="mg/L CaCO3">mg/L as CaCO₃</option>
                  <option value="meq/L">meq/L</option>
                  <option value="mg/L HCO3">mg/L as HCO₃</option>
                </SelectField>
              </div>
            ) : (
              <TitrationEntry form={form} errors={e} update={update} />
            )}
            {form.alkMode === 'titration' && derived.titration && <TitrationPlot t={derived.titration} unit={form.titEquipment === 'buret' ? 'mL' : 'counts'} />}
            <div class="row2">
              <TextField id="kit" label={form.kitAnalyte === 'calcium' ? 'Calcium (kit)' : 'Calcium hardness (kit)'} unit={form.kitUnit} numeric value={form.kitValue} error={e.kitValue} onInput={(v) => update({ kitValue: v })} />
              <SelectField id="kitUnit" label="Kit reports" value={`${form.kitAnalyte}|${form.kitUnit}`} onChange={(v) => { const [a, u] = v.split('|'); update({ kitAnalyte: a as SampleForm['kitAnalyte'], kitUnit: u as SampleForm['kitUnit'] }); }}>
                <option value="calcium|mg/L">Calcium, mg/L</option>
                <option value="calcium-hardness|mg/L CaCO3">Calcium hardness, mg/L as CaCO₃</option>
                <option value="calcium|mmol/L">Calcium, mmol/L</option>
              </SelectField>
            </div>
            <TextField id="totalHardness" label="Total hardness (kit, optional)" unit="mg/L as CaCO₃" numeric value={form.totalHardness} error={e.totalHardness} onInput={(v) => update({ totalHardness: v })} hint="With calcium hardness, gives magnesium." />
          </Section>

          <Section title="More ions and lab values (optional)" open={false} id="ions">
            {ION_FIELDS.map((f) => (
              <TextField key={f.key} id={`ion-${f.key}`} label={f.label} unit={f.unit} numeric value={form.ions[f.key]} error={e[`ions.${f.key}`]} onInput={(v) => update({ ions: { ...form.ions, [f.key]: v } })} />
            ))}
            {stored && stored.lab.length > 0 && (
              <div>
                <h3>Lab results (kept apart from field values)</h3>
                <ul>{stored.lab.map((l, i) => <li key={i}>{l.parameter}: {l.value} {l.unit}{l.qualifier ? ` (${l.qualifier})` : ''}</li>)}</ul>
              </div>
            )}
          </Section>

          <Section title="Conditions and remarks" open={false}>
            <Choice name="flow" label="Flow" value={form.flow} onChange={(v) => update({ flow: v })} options={[{ value: 'low', label: 'Low' }, { value: 'normal', label: 'Normal' }, { value: 'high', label: 'High' }, { value: 'rising', label: 'Rising' }, { value: 'falling', label: 'Falling' }, { value: 'unknown', label: 'Unknown' }]} />
            <Choice name="method" label="Method" value={form.method} onChange={(v) => update({ method: v })} options={[{ value: 'in-situ', label: 'In situ' }, { value: 'flow-through', label: 'Flow-through cell' }, { value: 'grab', label: 'Grab' }]} />
            <TextField id="weather" label="Weather" value={form.weather} onInput={(v) => update({ weather: v })} />
            <div class="field">
              <label for="remarks">Remarks</label>
              <textarea id="remarks" rows={3} value={form.remarks} onInput={(ev) => update({ remarks: (ev.currentTarget as HTMLTextAreaElement).value })} />
            </div>
            <fieldset class="choice">
              <legend>Qualifiers</legend>
              <div class="choice-row">
                {(['estimated', 'unstable', 'outside-calibration', 'suspect'] as const).map((q) => (
                  <label key={q} class={form.qualifiers.includes(q) ? 'choice-opt on' : 'choice-opt'}>
                    <input type="checkbox" checked={form.qualifiers.includes(q)} onChange={() => update({ qualifiers: form.qualifiers.includes(q) ? form.qualifiers.filter((x) => x !== q) : [...form.qualifiers, q] })} />
                    {q.replace('-', ' ')}
                  </label>
                ))}
              </div>
            </fieldset>
          </Section>

          {missing.length > 0 && <p class="field-error" role="alert">Before saving, add: {missing.join('; ')}.</p>}
          {saveError && (
            <div class="notice bad" role="alert">
              <p>{saveError.message}</p>
              <button type="button" class="btn btn-small" onClick={() => downloadText(`bankside-unsaved-entry-${Date.now()}.json`, JSON.stringify(form, null, 2), 'application/json')}>
                Download this entry
              </button>
            </div>
          )}
          <div class="actions">
            <button type="submit" class="btn btn-primary btn-block" disabled={saving}>{saving ? 'Saving…' : stored ? 'Save changes' : 'Save sample'}</button>
            {stored && !stored.deletedAt && (
              <button type="button" class="btn btn-block" onClick={async () => { await deleteSample(stored.id, settings.operator || 'field crew'); go(`#/today?date=${stored.localDate}&deleted=${stored.id}`); }}>
                Delete sample
              </button>
            )}
          </div>
          {stored && <History id={stored.id} />}
        </form>
        <ResultsPanel d={derived} />
      </div>
    </div>
  );
}

function TitrationEntry({ form, errors, update }: { form: SampleForm; errors: Record<string, string>; update: (p: Partial<SampleForm>) => void }) {
  const unit = form.titEquipment === 'buret' ? 'mL' : 'counts';
  const setPoint = (i: number, key: 'amount' | 'pH', v: string) => update({ titPoints: form.titPoints.map((p, k) => (k === i ? { ...p, [key]: v } : p)) });
  return (
    <div class="titration">
      <p class="caution">Acid titrant: gloves and eye protection; add acid to water, never water to acid.</p>
      <Choice name="titEq" label="Equipment" value={form.titEquipment} onChange={(v) => update({ titEquipment: v })} options={[{ value: 'buret', label: 'Buret (mL)' }, { value: 'digital-titrator', label: 'Digital titrator (counts)' }]} />
      <div class="row3">
        <TextField id="titVs" label="Sample volume" unit="mL" numeric value={form.titSampleMl} error={errors.titSampleMl} onInput={(v) => update({ titSampleMl: v })} />
        <TextField id="titN" label="Titrant normality" unit="N" numeric value={form.titNormality} error={errors.titNormality} onInput={(v) => update({ titNormality: v })} />
        <TextField id="titCf" label="Correction factor" numeric value={form.titCf} error={errors.titCf} onInput={(v) => update({ titCf: v })} />
      </div>
      <table class="points">
        <thead>
          <tr><th scope="col">#</th><th scope="col">Titrant ({unit})</th><th scope="col">pH</th></tr>
        </thead>
        <tbody>
          {form.titPoints.map((p, i) => (
            <tr key={i}>
              <td>{i + 1}</td>
              <td>
                <input aria-label={`Titrant point ${i + 1} (${unit})`} inputMode="decimal" value={p.amount} aria-invalid={errors[`titPoints.${i}.amount`] ? true : undefined} onInput={(ev) => setPoint(i, 'amount', (ev.currentTarget as HTMLInputElement).value)} />
              </td>
              <td>
                <input aria-label={`pH at point ${i + 1}`} inputMode="decimal" value={p.pH} aria-invalid={errors[`titPoints.${i}.pH`] ? true : undefined} onInput={(ev) => setPoint(i, 'pH', (ev.currentTarget as HTMLInputElement).value)} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {Object.entries(errors).filter(([k]) => k.startsWith('titPoints')).map(([k, m]) => <p key={k} class="field-error">Point {Number(k.split('.')[1]) + 1}: {m}</p>)}
      <button type="button" class="btn btn-small" onClick={() => update({ titPoints: [...form.titPoints, { amount: '', pH: '' }] })}>+ Add point</button>
    </div>
  );
}

function History({ id }: { id: string }) {
  const h = useLive(() => history(id), [id], ['samples']);
  if (!h.data || h.data.length === 0) return null;
  return (
    <details class="section">
      <summary>History ({h.data.length})</summary>
      <ol class="history">
        {h.data.map((r) => (
          <li key={r.id}>
            <strong>{r.action}</strong> by {r.by || 'unknown'} at {new Date(r.at).toLocaleString()}
            {r.action === 'update' && (
              <ul>{r.changes.slice(0, 12).map((c) => <li key={c.path}>{c.path}: {JSON.stringify(c.from)} → {JSON.stringify(c.to)}</li>)}</ul>
            )}
          </li>
        ))}
      </ol>
    </details>
  );
}
