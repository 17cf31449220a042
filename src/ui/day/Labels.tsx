import { useEffect, useState } from 'preact/hooks';
import { listDay, listSites } from '../../store/records';
import { todayLocal } from '../../records/time';
import { useLive } from '../data';
import { showDayLong, showTime } from '../format';
import type { Route } from '../router';

type QrFactory = (typeNumber: 0, level: 'L' | 'M' | 'Q' | 'H') => { addData(d: string): void; make(): void; getModuleCount(): number; isDark(r: number, c: number): boolean };

/** The QR symbol as one SVG path (drawn by us from the library's modules: no HTML strings, CSP-safe). */
function QrSvg({ qr, text }: { qr: QrFactory; text: string }) {
  const q = qr(0, 'M');
  q.addData(text);
  q.make();
  const n = q.getModuleCount();
  let d = '';
  for (let r = 0; r < n; r++) for (let c = 0; c < n; c++) if (q.isDark(r, c)) d += `M${c + 4} ${r + 4}h1v1h-1z`;
  return (
    <svg class="qr" viewBox={`0 0 ${n + 8} ${n + 8}`} role="img" aria-label={`QR code of ${text}`} data-modules={n}>
      <rect width={n + 8} height={n + 8} fill="#fff" />
      <path d={d} fill="#000" />
    </svg>
  );
}

/** Bottle labels for a day: the sample ID as text and as a QR code (the QR library loads only here). */
export function LabelsScreen({ route }: { route: Route }) {
  const date = route.query.get('date') || todayLocal();
  const samples = useLive(() => listDay(date), [date], ['samples']);
  const sites = useLive(listSites, [], ['sites']);
  const [qr, setQr] = useState<QrFactory | null>(null);
  const [err, setErr] = useState('');
  useEffect(() => {
    import('qrcode-generator')
      .then((m) => setQr(() => ((m as unknown as { default?: QrFactory }).default ?? (m as unknown as QrFactory))))
      .catch((e) => setErr(`QR codes unavailable (${e instanceof Error ? e.message : String(e)}): the IDs below are printed as text.`));
  }, []);
  const siteById = new Map((sites.data ?? []).map((s) => [s.id, s]));
  const list = samples.data ?? [];
  return (
    <section class="labels-screen">
      <p class="lead no-print">Labels for {showDayLong(date)}: one per sample. Print on label sheets or plain paper and tape them on; write the same ID on the bottle in waterproof ink.</p>
      {err && <p class="field-error">{err}</p>}
      <button type="button" class="btn btn-primary no-print" onClick={() => print()} disabled={list.length === 0}>Print labels</button>
      {list.length === 0 && <p class="muted">No samples on this day.</p>}
      <ul class="labels" aria-label="Bottle labels">
        {list.map((s) => {
          const code = s.sampleCode ?? s.id;
          const site = siteById.get(s.siteId);
          return (
            <li key={s.id} class="label">
              {qr ? <QrSvg qr={qr} text={code} /> : <span class="qr qr-wait" aria-hidden="true" />}
              <span class="label-text">
                <strong class="label-code">{code}</strong>
                <span>{site ? `${site.code} ${site.name}` : ''}</span>
                <span>{showDayLong(s.localDate)} {showTime(s.time)}{s.qc.type !== 'environmental' ? ` · ${s.qc.type}` : ''}</span>
              </span>
            </li>
          );
        })}
      </ul>
    </section>
  );
}
