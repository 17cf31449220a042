import { useEffect, useMemo, useRef, useState } from 'preact/hooks';
import type { Derived } from '../../records/derive';
import type { ChemWarning, StabilizationResult } from '../../chemistry';
import { isoWithOffset } from '../../records/time';
import type { Sample } from '../../records/schema';
import { onChange, setBeforeClose } from '../../store/connection';
import {
  adoptOrphanDraft,
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
import { Choice, CoreField, Fold, moveOnEnter, SelectField, TextField, TimeField } from '../components/Field';
import { Icon } from '../components/Icon';
import { ConflictChoice } from '../components/ConflictChoice';
import { NotFound } from '../components/NotFound';
import { RejudgeNote } from '../components/RejudgeNote';
import { liveTabIds, tabId } from '../tab';
import { RepeatedReadings } from '../components/Readings';
import { ResultsPanel } from '../components/Results';
import { StateBadge } from '../components/State';
import { SampleCode } from '../components/SampleCode';
import { ParentPicker, QcLiveVerdict } from '../day/QcSection';
import { dayMeters } from '../day/DayMeters';
import { TitrationPlot } from '../components/TitrationPlot';
import { useLive, useProfile, useProfileOf, useSettingsState } from '../data';
import { applyFormToSample, emptyForm, formFromSample, formToSample, ION_FIELDS, type SampleForm, type TimedRaw } from '../forms/sample-form';
import { deriveLive } from '../forms/live-derive';
import { useFolds } from '../folds';
import { showMoment, showTime } from '../format';
import { ACTION_WORDS, describeChange } from '../history-words';
import { splitWarnings } from '../warning-kinds';
import { go } from '../router';
import { registerDraftSaver } from '../sw-bridge';
import { downloadText } from '../../exchange/share';
import { NewSiteInline } from './Sites';

type SampleInputLike = Parameters<typeof saveSample>[0] & { id?: string; createdAt?: string; revision?: number; sampleCode?: string };

const AUTOSAVE_MS = 400;
/** while typing goes on without a pause, the draft is still saved at least this often */
const AUTOSAVE_MAX_WAIT_MS = 1000;

/** Drafts are kept per tab: "draft:sample:new:<tab>" or "draft:sample:<id>:<tab>". */
function draftPrefixFor(sampleId: string | undefined): string {
  return sampleId ? `draft:sample:${sampleId}` : 'draft:sample:new';
}

/** New sample (#/new) or an existing one (#/sample/<id>). Every keystroke is saved as a draft. */
export function SampleEditor({ sampleId, siteId }: { sampleId?: string; /** a new sample's site, when the day view offered it */ siteId?: string | undefined }) {
  const { settings, loaded: settingsLoaded } = useSettingsState();
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
  const [notFound, setNotFound] = useState(false);
  const [conflict, setConflict] = useState<Sample | null>(null);
  const profileOf = useProfileOf();
  const draftPrefix = draftPrefixFor(sampleId);
  const draftId = `${draftPrefix}:${tabId()}`;
  const formRef = useRef<SampleForm | null>(null);
  const dirty = useRef(false);
  /** a new form nobody has typed in and no draft replaced: Settings' defaults may still fill it */
  const fresh = useRef(!sampleId);
  const firstDirtyAt = useRef(0);
  /** the stored revision this edit started from */
  const baseRevision = useRef<number | undefined>(undefined);
  formRef.current = form;

  // Load: an unsaved draft wins over the stored record (nothing typed is lost).
  useEffect(() => {
    void loadSchemas(); // the draft's validation is ready before the first keystroke needs it
    let live = true;
    (async () => {
      const [own, existing] = await Promise.all([getDraft(draftId), sampleId ? getSample(sampleId) : Promise.resolve(undefined)]);
      let draft = own;
      if (!draft) {
        // A draft left by a tab that was closed or killed is taken over (never one of a live tab).
        const liveTabs = await liveTabIds();
        if (liveTabs) draft = await adoptOrphanDraft(draftPrefix, draftId, liveTabs);
      }
      if (!live) return;
      setStored(existing);
      baseRevision.current = draft?.baseRevision ?? existing?.revision;
      if (sampleId && !existing && !draft) return setNotFound(true);
      if (draft) {
        const restored = { ...emptyForm(), ...(draft.form as Partial<SampleForm>) } as SampleForm;
        if (dirty.current) {
          // The crew started typing before the old draft was read: keep both, under separate keys.
          await putDraft({ id: `${draftId}:${draft.updatedAt}`, kind: 'sample', form: draft.form });
          setOlderDraft({ form: restored, at: draft.updatedAt });
        } else {
          fresh.current = false;
          setForm(restored);
          setRestoredAt(draft.updatedAt);
        }
      } else if (existing) setForm(formFromSample(existing));
    })().catch((err: unknown) => {
      if (!live) return;
      setSaveError(toStoreError(err));
      if (!sampleId) setForm((f) => f ?? emptyForm());
    });
    return () => {
      live = false;
    };
  }, [draftId]);

  // Deleted or restored (here or in another tab): the record's state follows, the form is untouched.
  useEffect(() => {
    if (!sampleId) return;
    return onChange((n) => {
      if (n.store === 'samples') void getSample(sampleId).then((x) => x && setStored(x));
    });
  }, [sampleId]);

  // Saves are chained: whoever asks for a flush (a timer, the page hiding, an app update, another
  // tab's upgrade) waits for any save already under way, so nothing closes the db mid-save.
  const chain = useRef<Promise<void>>(Promise.resolve());
  const flush = (): Promise<void> => {
    chain.current = chain.current.catch(() => undefined).then(async () => {
      if (!dirty.current || !formRef.current) return;
      dirty.current = false;
      try {
        await putDraft({
          id: draftId,
          kind: 'sample',
          ...(sampleId ? { targetId: sampleId } : {}),
          ...(baseRevision.current !== undefined ? { baseRevision: baseRevision.current } : {}),
          form: formRef.current as unknown as Record<string, unknown>,
        });
      } catch (e) {
        dirty.current = true;
        throw e;
      }
    });
    return chain.current;
  };

  // Autosave 400 ms after a pause, and at least every second while typing goes on without one;
  // an immediate save when the page hides or updates.
  useEffect(() => {
    if (!form || !dirty.current) return;
    const wait = Math.max(0, Math.min(AUTOSAVE_MS, firstDirtyAt.current + AUTOSAVE_MAX_WAIT_MS - Date.now()));
    const t = setTimeout(() => {
      flush().catch((e) => setSaveError(toStoreError(e)));
    }, wait);
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
    if (!dirty.current) firstDirtyAt.current = Date.now();
    dirty.current = true;
    fresh.current = false;
    setForm((f) => (f ? { ...f, ...patch } : f));
  };

  // A new, untouched form takes the crew and the usual units from Settings once they are read.
  useEffect(() => {
    if (sampleId || !fresh.current) return;
    const u = settings.units;
    setForm((f) => (f ? { ...f, crew: f.crew || settings.operator, condUnit: u.conductance, doUnit: u.do, alkUnit: u.alkalinity, pressureUnit: u.pressure } : f));
  }, [settings]);

  const folds = useFolds(settingsLoaded ? settings.operator : null);
  const parsed = useMemo(() => (form ? formToSample(form) : null), [form]);
  // formToSample fills every default the derivation reads (kits, ions, alpha), so no schema pass is needed here.
  // A stored sample is judged under the profile version it was recorded with; a new one under the active profile.
  const judgedBy = stored ? profileOf(stored) : profile;
  const live = useMemo(() => (form && parsed ? deriveLive(form, parsed.record, stored?.lab ?? [], settings, judgedBy) : null), [parsed, settings, stored, judgedBy]);

  if (notFound) return <NotFound what={`No sample “${sampleId}” on this phone.`} detail="It may have been recorded on another phone, or the link is incomplete." />;

  if (!form || !parsed || !live) return saveError ? <p class="notice bad" role="alert">{saveError.message}</p> : <p class="muted">Opening…</p>;
  const derived = live.derived;
  const blocking: Record<string, string> = { ...parsed.errors, ...live.errors };
  // shown on each box: what must be corrected, and warnings about that very entry
  const e: Record<string, string> = { ...live.marks, ...blocking };
  const warn = splitWarnings(derived.warnings);

  /**
   * Save: the record and the removal of its draft happen in one transaction, and the save carries
   * the revision the edit started from. 'mine' overwrites a newer revision the crew has seen;
   * 'both' keeps the other version and saves this entry as a separate sample.
   */
  const save = async (resolve?: 'mine' | 'both') => {
    setSaveError(null);
    const need = [...parsed.missing];
    const wrong = Object.keys(blocking);
    if (wrong.length > 0) {
      need.push(`a correction to ${[...new Set(wrong.map(fieldWords))].join(', ')} (marked in red)`);
      for (const k of wrong) if (FOLD_OF(k)) folds.set(FOLD_OF(k)!, true); // open where the red box is
    }
    setMissing(need);
    if (need.length > 0) return;
    setSaving(true);
    const by = settings.operator || 'field crew';
    try {
      await chain.current.catch(() => undefined); // no draft write may land after the save
      dirty.current = false;
      const base = resolve === 'both' ? conflict : stored;
      let rec: Sample;
      if (base && resolve === 'both') {
        // a separate sample: its own id, revision history and readable code
        const { id: _id, createdAt: _c, revision: _r, sampleCode: _code, ...copy } = applyFormToSample(base, parsed.record) as SampleInputLike;
        rec = await saveSample(copy as Parameters<typeof saveSample>[0], by, { draftId, note: `kept both: your version of ${base.id}, saved beside revision ${base.revision}` });
      } else if (base) {
        const expected = resolve === 'mine' && conflict ? conflict.revision : baseRevision.current;
        rec = await saveSample(applyFormToSample(base, parsed.record), by, { draftId, ...(expected !== undefined ? { expectedRevision: expected } : {}) });
      } else {
        rec = await saveSample({ ...parsed.record, profileId: profile.id, profileVersion: profile.version, createdBy: by, instrumentIds: await dayMeters(parsed.record.time) }, by, { draftId });
      }
      setConflict(null);
      go(`#/today?date=${rec.localDate}&saved=${rec.id}`);
    } catch (err) {
      const se = toStoreError(err);
      dirty.current = true;
      if (se.kind === 'conflict') setConflict(se.current as Sample);
      else setSaveError(se);
      await flush().catch(() => undefined);
    } finally {
      setSaving(false);
    }
  };
  const keepTheirs = async () => {
    if (!conflict) return;
    await deleteDraft(draftId);
    dirty.current = false;
    baseRevision.current = conflict.revision;
    setStored(conflict);
    setForm(formFromSample(conflict));
    setConflict(null);
  };

  const siteList = sites.data ?? [];
  const site = siteList.find((x) => x.id === form.siteId);
  const condUnitLabel = form.condUnit === 'mS/cm' ? 'mS/cm' : 'µS/cm';
  const st = derived.stability;
  const a = derived.analysis;
  const fold = (id: string, fallback = false) => ({ id, open: folds.isOpen(id, fallback), onToggle: (o: boolean) => folds.set(id, o) });
  const extraReadings = form.temp.length + form.cond.length + form.pH.length + form.do.length - 4;
  const ionCount = ION_FIELDS.filter((f) => form.ions[f.key].trim()).length + (form.totalHardness.trim() ? 1 : 0);
  const kitLabel = form.kitAnalyte === 'calcium' ? 'Calcium (kit)' : 'Calcium hardness (kit)';
  const stab = (x: StabilizationResult | undefined) =>
    x && x.window.length > 1 ? <span class={x.stable ? 'stable yes' : 'stable no'}>{x.stable ? `Stable, reports ${x.median}` : 'Still drifting'}</span> : null;
  const deleted = !!stored?.deletedAt;

  return (
    <div class="editor">
      {stored?.sampleCode && <p class="sample-code-line">Sample ID <SampleCode code={stored.sampleCode} /></p>}
      {restoredAt && (
        <p class="notice" role="status">
          Restored your unsaved entry from {showMoment(restoredAt)}.{' '}
          <button type="button" class="linkish" onClick={async () => { await deleteDraft(draftId); setRestoredAt(''); setForm(stored ? formFromSample(stored) : emptyForm(new Date(), { crew: settings.operator, units: settings.units })); }}>
            Discard it
          </button>
        </p>
      )}
      {olderDraft && (
        <p class="notice" role="status">
          An unsaved entry from {showMoment(olderDraft.at)} was also found.{' '}
          <button type="button" class="linkish" onClick={async () => { if (form) await putDraft({ id: `${draftId}:${isoWithOffset()}`, kind: 'sample', form: form as unknown as Record<string, unknown> }); dirty.current = true; setForm(olderDraft.form); setOlderDraft(null); }}>Open it instead</button>
        </p>
      )}
      {stored && <RejudgeNote sample={stored} judgedBy={judgedBy} active={profile} by={settings.operator || 'field crew'} onDone={(s) => { setStored(s); baseRevision.current = s.revision; }} />}
      {deleted && <DeletedNotice id={stored!.id} by={settings.operator} />}
      <div class="editor-grid">
        <form class="editor-form" onSubmit={(ev) => { ev.preventDefault(); void save(); }} onKeyDown={moveOnEnter} noValidate>
          <div class="core" aria-label="Site and core readings">
            <div class="site-row">
              <SelectField key={`site-${siteList.length}`} id="site" label="Site" value={form.siteId} onChange={(v) => update({ siteId: v })} error={missing.includes('site') ? 'Pick a site or add one here.' : undefined}>
                <option value="">Choose a site…</option>
                {siteList.map((s) => (
                  <option key={s.id} value={s.id}>{s.code} · {s.name}</option>
                ))}
              </SelectField>
              <NewSiteInline onCreated={(id) => update({ siteId: id })} />
            </div>
            <Fold
              {...fold('when')}
              title="When, who"
              extra={[showTime(form.time), form.crew || 'no crew yet', form.qcType !== 'environmental' ? QC_WORDS[form.qcType] : ''].filter(Boolean).join(' · ')}
            >
              <TimeField id="time" label="Sampling time" iso={form.time} error={e.time} onChange={(v) => update({ time: v })} />
              <TextField id="crew" label="Crew (comma-separated)" value={form.crew} onInput={(v) => update({ crew: v })} />
              <Choice name="qc" label="Sample type" value={form.qcType} onChange={(v) => update({ qcType: v })} options={[{ value: 'environmental', label: 'Environmental' }, { value: 'replicate', label: 'Replicate' }, { value: 'blank', label: 'Blank' }]} />
              <ParentPicker qcType={form.qcType} parentId={form.parentId} time={form.time} selfId={sampleId} onParent={(v) => update({ parentId: v })} />
            </Fold>

            <CoreField id="temp-0" label="Water temperature" unit="°C" value={form.temp[0]!.v} error={e['temp.0']} next="cond-0" status={stab(st.temperature)} onInput={(v) => update({ temp: setFirst(form.temp, v) })} />
            <CoreField
              id="cond-0"
              label={form.condMode === 'sc' ? 'Specific conductance' : 'Conductivity (raw EC)'}
              value={form.cond[0]!.v}
              error={e['cond.0']}
              next="ph-0"
              status={stab(st.sc)}
              onInput={(v) => update({ cond: setFirst(form.cond, v) })}
              unit={<UnitPick id="condUnit" label="Conductance unit" value={form.condUnit} onChange={(v) => update({ condUnit: v as SampleForm['condUnit'] })} options={[['uS/cm', 'µS/cm'], ['mS/cm', 'mS/cm']]} />}
            />
            <CoreField id="ph-0" label="pH" value={form.pH[0]!.v} error={e['pH.0']} next="do-0" status={stab(st.pH)} onInput={(v) => update({ pH: setFirst(form.pH, v) })} />
            <CoreField
              id="do-0"
              label="Dissolved oxygen"
              value={form.do[0]!.v}
              error={e['do.0']}
              next={form.alkMode === 'direct' ? 'alk' : 'kit'}
              status={stab(st.do)}
              onInput={(v) => update({ do: setFirst(form.do, v) })}
              unit={<UnitPick id="doUnit" label="Dissolved oxygen unit" value={form.doUnit} onChange={(v) => update({ doUnit: v as SampleForm['doUnit'] })} options={[['mg/L', 'mg/L'], ['%', '% sat.']]} />}
            />
            {form.alkMode === 'direct' ? (
              <CoreField
                id="alk"
                label="Alkalinity"
                value={form.alk}
                error={e.alk}
                next="kit"
                onInput={(v) => update({ alk: v })}
                unit={<UnitPick id="alkUnit" label="Alkalinity unit" value={form.alkUnit} onChange={(v) => update({ alkUnit: v as SampleForm['alkUnit'] })} options={[['mg/L CaCO3', 'mg/L CaCO₃'], ['meq/L', 'meq/L'], ['mg/L HCO3', 'mg/L HCO₃']]} />}
              />
            ) : (
              <p class="core-row core-note">
                <span>Alkalinity</span>
                <span>{derived.titration?.alkalinityMgLCaCO3 !== undefined ? `${derived.titration.alkalinityMgLCaCO3.toFixed(1)} mg/L as CaCO₃ from the titration` : 'from the titration points below'}</span>
              </p>
            )}
            <CoreField
              id="kit"
              label={kitLabel}
              value={form.kitValue}
              error={e.kitValue}
              onInput={(v) => update({ kitValue: v })}
              unit={
                <UnitPick id="kitUnit" label="Kit reports" value={`${form.kitAnalyte}|${form.kitUnit}`} onChange={(v) => { const [an, u] = v.split('|'); update({ kitAnalyte: an as SampleForm['kitAnalyte'], kitUnit: u as SampleForm['kitUnit'] }); }}
                  options={[['calcium|mg/L', 'mg/L Ca'], ['calcium-hardness|mg/L CaCO3', 'mg/L CaCO₃'], ['calcium|mmol/L', 'mmol/L Ca']]} />
              }
            />
          </div>

          <QcLiveVerdict qcType={form.qcType} parentId={form.parentId} derived={derived} />
          <SaveBlock
            derived={derived}
            action={warn.action}
            missingHints={warn.missing}
            missing={missing}
            saving={saving}
            label={stored ? 'Save changes' : 'Save sample'}
            disabled={deleted}
          />
          {conflict && <ConflictChoice theirs={conflict} onMine={() => void save('mine')} onTheirs={() => void keepTheirs()} onBoth={() => void save('both')} />}
          {saveError && (
            <div class="notice bad" role="alert">
              <p>{saveError.message}</p>
              <button type="button" class="btn" onClick={() => downloadText(`bankside-unsaved-entry-${Date.now()}.json`, JSON.stringify(form, null, 2), 'application/json')}>
                Download this entry
              </button>
            </div>
          )}

          <Fold {...fold('readings')} title="Repeated readings" extra={extraReadings > 0 ? `${extraReadings} more` : undefined}>
            <RepeatedReadings fromSecond id="temp" label="Water temperature" unit="°C" rows={form.temp} errors={e} errorKey="temp" stability={st.temperature} onChange={(rows) => update({ temp: rows })} />
            <RepeatedReadings fromSecond id="cond" label={form.condMode === 'sc' ? 'Specific conductance' : 'Conductivity (raw EC)'} unit={condUnitLabel} rows={form.cond} errors={e} errorKey="cond" stability={st.sc} onChange={(rows) => update({ cond: rows })} />
            <RepeatedReadings fromSecond id="ph" label="pH" unit="" rows={form.pH} errors={e} errorKey="pH" stability={st.pH} onChange={(rows) => update({ pH: rows })} />
            <RepeatedReadings fromSecond id="do" label="Dissolved oxygen" unit={form.doUnit === '%' ? '% sat.' : form.doUnit} rows={form.do} errors={e} errorKey="do" stability={st.do} onChange={(rows) => update({ do: rows })} />
            <Choice name="condMode" label="Conductance as read" value={form.condMode} onChange={(v) => update({ condMode: v })} options={[{ value: 'sc', label: 'SC at 25 °C' }, { value: 'ec', label: 'Raw EC' }]} />
            {form.condMode === 'ec' && (
              <>
                <TextField id="ecTemp" label="Temperature of the EC reading" unit="°C" numeric value={form.ecTempC} error={e.ecTempC} onInput={(v) => update({ ecTempC: v })} hint="Leave empty to use the water temperature." />
                <TextField id="alpha" label="Compensation coefficient α" unit="/°C" numeric value={form.alpha} error={e.alpha} onInput={(v) => update({ alpha: v })} />
              </>
            )}
          </Fold>

          <Fold {...fold('titration', form.alkMode === 'titration')} title="Alkalinity titration" extra={form.alkMode === 'titration' ? `${form.titPoints.filter((x) => x.pH.trim()).length} points` : undefined}>
            <Choice name="alkMode" label="Alkalinity" value={form.alkMode} onChange={(v) => update({ alkMode: v })} options={[{ value: 'direct', label: 'Type the result' }, { value: 'titration', label: 'Titration points' }]} />
            {form.alkMode === 'titration' && <TitrationEntry form={form} errors={e} update={update} />}
            {form.alkMode === 'titration' && derived.titration && <TitrationPlot t={derived.titration} unit={form.titEquipment === 'buret' ? 'mL' : 'counts'} />}
          </Fold>

          <Fold {...fold('ions')} title="More ions and lab values" extra={ionCount > 0 ? `${ionCount} entered` : undefined}>
            <div class="choice-row">
              <label class={form.kitFiltered ? 'choice-opt on' : 'choice-opt'}>
                <input type="checkbox" checked={form.kitFiltered === true} onChange={() => update({ kitFiltered: !form.kitFiltered })} />
                Kits run on filtered water (dissolved)
              </label>
            </div>
            <TextField id="totalHardness" label="Total hardness (kit)" unit="mg/L as CaCO₃" numeric value={form.totalHardness} error={e.totalHardness} onInput={(v) => update({ totalHardness: v })} hint="With calcium hardness, gives magnesium." />
            {ION_FIELDS.map((f) => (
              <TextField key={f.key} id={`ion-${f.key}`} label={f.label} unit={f.unit} numeric value={form.ions[f.key]} error={e[`ions.${f.key}`]} onInput={(v) => update({ ions: { ...form.ions, [f.key]: v } })} />
            ))}
            {stored && stored.lab.length > 0 && (
              <div>
                <h3>Lab results (kept apart from field values)</h3>
                <ul>{stored.lab.map((l, i) => <li key={i}>{l.parameter}: {l.value} {l.unit}{l.qualifier ? ` (${l.qualifier})` : ''}</li>)}</ul>
              </div>
            )}
          </Fold>

          <Fold {...fold('conditions')} title="Conditions" extra={[form.pressure ? `${form.pressure} ${form.pressureUnit}` : '', form.flow !== 'unknown' ? `flow ${form.flow}` : ''].filter(Boolean).join(' · ') || undefined}>
            <div class="row2">
              <TextField id="pressure" label="Barometric pressure (true, at the site)" unit={form.pressureUnit} numeric value={form.pressure} error={e.pressure} onInput={(v) => update({ pressure: v })} />
              <SelectField id="pressureUnit" label="Pressure unit" value={form.pressureUnit} onChange={(v) => update({ pressureUnit: v as SampleForm['pressureUnit'] })}>
                <option value="hPa">hPa</option>
                <option value="kPa">kPa</option>
                <option value="mmHg">mmHg</option>
              </SelectField>
            </div>
            <Choice name="flow" label="Flow" value={form.flow} onChange={(v) => update({ flow: v })} options={[{ value: 'low', label: 'Low' }, { value: 'normal', label: 'Normal' }, { value: 'high', label: 'High' }, { value: 'rising', label: 'Rising' }, { value: 'falling', label: 'Falling' }, { value: 'unknown', label: 'Unknown' }]} />
            <Choice name="method" label="Method" value={form.method} onChange={(v) => update({ method: v })} options={[{ value: 'in-situ', label: 'In situ' }, { value: 'flow-through', label: 'Flow-through cell' }, { value: 'grab', label: 'Grab' }]} />
            <TextField id="weather" label="Weather" value={form.weather} onInput={(v) => update({ weather: v })} />
          </Fold>

          <Fold {...fold('remarks')} title="Remarks and qualifiers" extra={form.remarks.trim() || form.qualifiers.length ? 'entered' : undefined}>
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
                    {QUALIFIER_WORDS[q]}
                  </label>
                ))}
              </div>
            </fieldset>
          </Fold>

          <Fold {...fold('results', true)} title="Results in full" extra={a?.saturationIndex.calcite !== undefined ? `SI ${a.saturationIndex.calcite.toFixed(2)}` : undefined}>
            <ResultsPanel d={derived} />
          </Fold>
          {stored && <History id={stored.id} doUnit={form.doUnit} siteName={(id) => siteList.find((x) => x.id === id)?.code} />}
          {stored && !deleted && <DeleteSample id={stored.id} by={settings.operator} />}
          {stored && deleted && <DeletedNotice id={stored.id} by={settings.operator} />}
          {site?.notes && <p class="muted site-note">{site.code}: {site.notes}</p>}
        </form>
      </div>
    </div>
  );
}

/** The box an error key belongs to, in words, for "Before saving, add: …". */
function fieldWords(key: string): string {
  const [head = '', sub = ''] = key.split('.');
  const words: Record<string, string> = {
    time: 'the sampling time', temp: 'water temperature', cond: 'conductance', pH: 'pH', do: 'dissolved oxygen', alk: 'alkalinity',
    kitValue: 'the calcium kit', totalHardness: 'total hardness', pressure: 'barometric pressure', ecTempC: 'the EC reading’s temperature',
    alpha: 'the compensation coefficient', titSampleMl: 'the titration', titNormality: 'the titration', titCf: 'the titration', titPoints: 'the titration points',
  };
  if (head === 'ions') return ION_FIELDS.find((f) => f.key === sub)?.label.toLowerCase() ?? 'an ion';
  return words[head] ?? head;
}

/** The folded section that holds a box, so an error there can open it. */
function FOLD_OF(key: string): string | undefined {
  const [head = '', sub = '0'] = key.split('.');
  if (['temp', 'cond', 'pH', 'do'].includes(head)) return sub === '0' ? undefined : 'readings';
  if (head === 'ecTempC' || head === 'alpha') return 'readings';
  if (head.startsWith('tit')) return 'titration';
  if (head === 'ions' || head === 'totalHardness') return 'ions';
  if (head === 'pressure') return 'conditions';
  if (head === 'time') return 'when';
  return undefined;
}

const QC_WORDS: Record<SampleForm['qcType'], string> = { environmental: 'environmental', replicate: 'replicate', blank: 'blank' };
const QUALIFIER_WORDS: Record<SampleForm['qualifiers'][number], string> = { estimated: 'Estimated', unstable: 'Unstable', 'outside-calibration': 'Outside calibration', suspect: 'Suspect' };

/** The first reading of a repeated parameter, typed in the core row; its time is the first keystroke's. */
function setFirst(rows: TimedRaw[], v: string): TimedRaw[] {
  const [first, ...rest] = rows;
  return [{ v, t: first?.t || (v.trim() ? isoWithOffset() : '') }, ...rest];
}

/** A unit chosen beside its number (a native select: large, and the phone's own picker). */
function UnitPick(p: { id: string; label: string; value: string; onChange: (v: string) => void; options: Array<[string, string]> }) {
  return (
    <select id={p.id} class="unit-pick" aria-label={p.label} value={p.value} onChange={(e) => p.onChange((e.currentTarget as HTMLSelectElement).value)}>
      {p.options.map(([v, l]) => <option key={v} value={v}>{l}</option>)}
    </select>
  );
}

/**
 * Save, with what the crew must know at that moment right beside it: the live state and the
 * warnings that call for action (re-measure, check a unit). Standing notices stay in the details.
 */
function SaveBlock(p: { derived: Derived; action: ChemWarning[]; missingHints: ChemWarning[]; missing: string[]; saving: boolean; label: string; disabled: boolean }) {
  const a = p.derived.analysis;
  const si = a?.saturationIndex.calcite;
  return (
    <div class="save-block" data-testid="save-block">
      <div class="save-state">
        <StateBadge state={a?.calciteState ?? 'unknown'} />
        {si !== undefined && <span class="mini-si">SI {si.toFixed(2)} ± {(a!.calciteSiUncertainty ?? 0).toFixed(2)}</span>}
      </div>
      {p.derived.error && <p class="field-error" role="alert">{p.derived.error.message}</p>}
      {p.action.length > 0 && (
        <ul class="save-warnings" aria-label="Check before you leave the site">
          {p.action.map((w, i) => (
            <li key={`${w.code}-${i}`} data-code={w.code}>
              <Icon name="warn" size={20} /> <span>{w.message}</span>
            </li>
          ))}
        </ul>
      )}
      {p.action.length === 0 && p.missingHints.length > 0 && <p class="muted save-hint">{p.missingHints[0]!.message}</p>}
      {p.missing.length > 0 && <p class="field-error" role="alert">Before saving, add: {p.missing.join('; ')}.</p>}
      <button type="submit" class="btn btn-primary btn-block save-btn" disabled={p.saving || p.disabled}>
        {p.saving ? 'Saving…' : p.label}
      </button>
    </div>
  );
}

/** Delete asks once, in place; the sample then shows as deleted with Undo on this same screen. */
function DeleteSample({ id, by }: { id: string; by: string }) {
  const [asking, setAsking] = useState(false);
  if (!asking) {
    return (
      <div class="danger-zone">
        <button type="button" class="btn btn-block btn-quiet" onClick={() => setAsking(true)}>
          <Icon name="trash" /> Delete this sample…
        </button>
      </div>
    );
  }
  return (
    <div class="danger-zone notice warn" role="alertdialog" aria-label="Delete this sample?">
      <p><strong>Delete this sample?</strong> It leaves the day list and exports; you can undo it here.</p>
      <div class="row2 always">
        <button type="button" class="btn" onClick={() => setAsking(false)}>Keep it</button>
        <button type="button" class="btn btn-danger" onClick={async () => { await deleteSample(id, by || 'field crew'); setAsking(false); }}>Delete</button>
      </div>
    </div>
  );
}

function DeletedNotice({ id, by }: { id: string; by: string }) {
  return (
    <p class="notice warn deleted-notice" role="status">
      This sample is deleted.{' '}
      <button type="button" class="btn" onClick={() => restoreSample(id, by || 'field crew')}>
        <Icon name="undo" /> Undo delete
      </button>
    </p>
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

function History({ id, doUnit, siteName }: { id: string; doUnit: string; siteName: (id: string) => string | undefined }) {
  const h = useLive(() => history(id), [id], ['samples']);
  if (!h.data || h.data.length === 0) return null;
  return (
    <details class="section">
      <summary>History ({h.data.length})</summary>
      <ol class="history">
        {h.data.map((r) => (
          <li key={r.id}>
            <strong>{ACTION_WORDS[r.action] ?? r.action}</strong> by {r.by || 'unknown'}, {showMoment(r.at)}
            {r.action === 'update' && (
              <ul>{r.changes.filter((c) => c.path !== 'updatedAt').slice(0, 12).map((c) => <li key={c.path}>{describeChange(c, doUnit, siteName)}</li>)}</ul>
            )}
          </li>
        ))}
      </ol>
    </details>
  );
}
