import { useMemo } from 'preact/hooks';
import type { Derived } from '../../records/derive';
import { derivedFor } from '../../records/derived-cache';
import { qcVerdictFor } from '../../records/qc';
import type { Sample, Site } from '../../records/schema';
import { getSample, listDay, listSites } from '../../store/records';
import { useLive, useProfile, useSettings } from '../data';
import { SampleCode } from '../components/SampleCode';
import { QcVerdictView } from './QcVerdictView';

const hhmm = (iso: string) => iso.slice(11, 16);

/** How a possible parent is offered: "09:30 · WF-01 · WF-01-20260614-0930". */
export function parentLabel(s: Sample, site: Site | undefined): string {
  return `${hhmm(s.time)} · ${site?.code ?? '?'} · ${s.sampleCode ?? s.id}`;
}

/** A replicate's or blank's parent, picked from the same day's environmental samples (never typed). */
export function ParentPicker(p: { qcType: Sample['qc']['type']; parentId: string; time: string; selfId?: string | undefined; onParent: (id: string) => void }) {
  const date = p.time.slice(0, 10);
  const day = useLive(() => listDay(date), [date], ['samples']);
  const sites = useLive(listSites, [], ['sites']);
  if (p.qcType === 'environmental') return null;
  const siteById = new Map((sites.data ?? []).map((s) => [s.id, s]));
  const candidates = (day.data ?? []).filter((s) => s.id !== p.selfId && s.qc.type === 'environmental');
  const parent = (day.data ?? []).find((s) => s.id === p.parentId);
  return (
    <div class="field qc-parent">
      <label for="parent">{p.qcType === 'replicate' ? 'Replicate of' : 'Blank for (optional)'}</label>
      <select id="parent" key={`parent-${candidates.length}`} value={p.parentId} onChange={(e) => p.onParent((e.currentTarget as HTMLSelectElement).value)}>
        <option value="">{candidates.length ? 'Choose the sample…' : 'No environmental sample on this day yet'}</option>
        {candidates.map((s) => <option key={s.id} value={s.id}>{parentLabel(s, siteById.get(s.siteId))}</option>)}
        {p.parentId && !candidates.some((s) => s.id === p.parentId) && <option value={p.parentId}>{parent ? parentLabel(parent, siteById.get(parent.siteId)) : 'a sample from another day'}</option>}
      </select>
      {parent?.sampleCode && <p class="hint">Parent sample ID <SampleCode code={parent.sampleCode} /></p>}
    </div>
  );
}

/** The replicate's or blank's verdict while the crew is still at the bank (beside Save). */
export function QcLiveVerdict(p: { qcType: Sample['qc']['type']; parentId: string; derived: Derived }) {
  const settings = useSettings();
  const profile = useProfile();
  const parent = useLive(() => (p.parentId ? getSample(p.parentId) : Promise.resolve(undefined)), [p.parentId], ['samples']);
  const verdict = useMemo(
    () => qcVerdictFor({ qc: { type: p.qcType } }, p.derived, parent.data ? { derived: derivedFor(parent.data, settings, profile) } : undefined, profile),
    [p.qcType, p.derived, parent.data, settings, profile],
  );
  if (p.qcType === 'environmental') return null;
  return (
    <div class="qc-live">
      {p.qcType === 'blank' && <p class="hint">A blank is judged against the profile’s blank limits, not against natural-water ranges.</p>}
      {p.qcType === 'replicate' && !parent.data && <p class="hint">Pick the sample this replicates (When, who) to see whether they agree.</p>}
      <QcVerdictView verdict={verdict} />
    </div>
  );
}
