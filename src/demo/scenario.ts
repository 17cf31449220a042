// The invented demo scenario: Wrenfold Creek, a made-up limestone creek with a CO₂-rich spring.
// Every name, place, coordinate, person and value here is invented for the demo; none is real data.
import { isoWithOffset } from '../records/time';
import type { SampleInputRecord, SiteInput, InstrumentInput, CalibrationInput } from '../store/records';

export const DEMO_BY = 'demo scenario';

export const DEMO_SITES: SiteInput[] = [
  { id: 'demo-site-wf01', code: 'WF-01', name: 'Wrenfold Creek at the upper footbridge', type: 'stream', latitude: 45.50321, longitude: -110.90112, datum: 'WGS84', accuracyM: 5, elevationM: 1710, notes: 'Invented demo site. Gravel riffle, wade from the left bank.', demo: true },
  { id: 'demo-site-wf02', code: 'WF-02', name: 'Limekiln spring (orifice)', type: 'spring', latitude: 45.49870, longitude: -110.89544, datum: 'WGS84', accuracyM: 8, elevationM: 1695, notes: 'Invented demo site. Measure at the orifice; the water degasses within metres.', demo: true },
  { id: 'demo-site-wf03', code: 'WF-03', name: 'Wrenfold Creek above the mill weir', type: 'stream', latitude: 45.49102, longitude: -110.88071, datum: 'WGS84', accuracyM: 4, elevationM: 1672, notes: 'Invented demo site. Travertine crusts on the weir face.', demo: true },
];

export const DEMO_INSTRUMENTS: InstrumentInput[] = [
  { id: 'demo-meter-a', name: 'Sonde A', make: 'Demo', model: 'Multiparameter', serial: 'DEMO-0001', sensors: ['temperature', 'pH', 'sc', 'do'], demo: true },
];

const CREW = ['T. Mills', 'J. Reyes'];

/** One invented visit. */
interface Visit {
  site: string;
  hhmm: string;
  temp: number[];
  sc: number[];
  pH: number[];
  doMgL: number;
  alk?: number;
  ca: number;
  titration?: boolean;
  remarks: string;
  extraIons?: Record<string, number>;
}

const DAY_VISITS: Visit[][] = [
  [
    { site: 'demo-site-wf02', hhmm: '08:40', temp: [9.6, 9.5, 9.5, 9.5, 9.5], sc: [612, 608, 607, 607, 606], pH: [7.12, 7.08, 7.06, 7.05, 7.05], doMgL: 6.1, ca: 101, titration: true, remarks: 'Spring orifice; bubbles rising. Titration at the bank.' },
    { site: 'demo-site-wf01', hhmm: '10:15', temp: [7.8, 7.8, 7.9, 7.9, 7.9], sc: [402, 401, 401, 400, 401], pH: [8.02, 8.05, 8.06, 8.06, 8.07], doMgL: 10.9, alk: 168, ca: 62, remarks: 'Clear, moderate flow.' },
    { site: 'demo-site-wf03', hhmm: '12:05', temp: [10.4, 10.5, 10.5, 10.6, 10.6], sc: [455, 453, 452, 452, 452], pH: [8.31, 8.33, 8.34, 8.34, 8.35], doMgL: 10.6, alk: 194, ca: 70, remarks: 'Fresh travertine on the weir.', extraIons: { mgMgL: 14.2, naMgL: 6.1, kMgL: 1.4, clMgL: 7.9, so4MgL: 21.5 } },
  ],
  [
    { site: 'demo-site-wf02', hhmm: '09:05', temp: [9.5, 9.5, 9.5, 9.5, 9.5], sc: [610, 609, 609, 608, 608], pH: [7.02, 7.04, 7.04, 7.05, 7.04], doMgL: 6.0, alk: 292, ca: 100, remarks: 'As yesterday.' },
    { site: 'demo-site-wf03', hhmm: '11:30', temp: [11.2, 11.3, 11.3, 11.3, 11.4], sc: [449, 450, 449, 449, 449], pH: [8.36, 8.38, 8.38, 8.39, 8.39], doMgL: 10.8, alk: 191, ca: 69, remarks: '' },
  ],
  [
    { site: 'demo-site-wf01', hhmm: '09:20', temp: [6.9, 7.0, 7.0, 7.0, 7.0], sc: [396, 397, 398, 398, 398], pH: [7.98, 8.0, 8.01, 8.01, 8.02], doMgL: 11.2, alk: 165, ca: 61, remarks: 'Light rain overnight; flow rising slightly.' },
    { site: 'demo-site-wf02', hhmm: '10:40', temp: [9.5, 9.5, 9.5, 9.5, 9.5], sc: [611, 610, 610, 610, 609], pH: [7.06, 7.05, 7.05, 7.05, 7.05], doMgL: 6.2, alk: 289, ca: 99, remarks: '' },
    { site: 'demo-site-wf03', hhmm: '12:50', temp: [10.1, 10.1, 10.2, 10.2, 10.2], sc: [448, 448, 447, 447, 447], pH: [8.29, 8.3, 8.3, 8.31, 8.31], doMgL: 10.7, alk: 190, ca: 69, remarks: '' },
  ],
];

/** An invented digital-titrator curve (1.6 N, 100 mL) for the spring, about 150 mg/L as CaCO₃ per 150 counts. */
const DEMO_TITRATION_POINTS = [
  [0, 7.06], [60, 6.63], [120, 6.2], [170, 5.86], [210, 5.5], [225, 5.28], [235, 5.02], [242, 4.7], [248, 4.39], [255, 4.08], [265, 3.78], [280, 3.5], [300, 3.27], [330, 3.05], [370, 2.87],
] as const;

function at(date: Date, hhmm: string, plusSeconds = 0): string {
  const [h, m] = hhmm.split(':').map(Number);
  const d = new Date(date);
  d.setHours(h!, m!, 0, 0);
  d.setSeconds(d.getSeconds() + plusSeconds);
  return isoWithOffset(d);
}

function series(values: number[], date: Date, hhmm: string) {
  return values.map((value, i) => ({ time: at(date, hhmm, i * 30), value }));
}

/** The scenario as records, dated today and the two days before. */
export function demoRecords(today = new Date()): { samples: SampleInputRecord[]; calibrations: CalibrationInput[] } {
  const samples: SampleInputRecord[] = [];
  const calibrations: CalibrationInput[] = [];
  DAY_VISITS.forEach((visits, k) => {
    const date = new Date(today);
    date.setDate(date.getDate() - (DAY_VISITS.length - 1 - k));
    const morning = at(date, '07:45');
    calibrations.push(
      {
        id: `demo-cal-ph-${k}`, instrumentId: 'demo-meter-a', parameter: 'pH', time: morning, operator: CREW[0]!, kind: 'calibration',
        entries: { parameter: 'pH', buffers: [{ bufferPH: 7.0, mV: -4.2, tempC: 12 }, { bufferPH: 10.01, mV: -173.1, tempC: 12 }, { bufferPH: 4.0, mV: 162.9, tempC: 12 }] },
        pass: true, profileId: 'bankside-default', profileVersion: 1, demo: true,
      },
      {
        id: `demo-cal-sc-${k}`, instrumentId: 'demo-meter-a', parameter: 'sc', time: at(date, '07:55'), operator: CREW[0]!, kind: 'check',
        entries: { parameter: 'sc', standardUsPerCm: 1413, readingUsPerCm: 1402 + k * 4 },
        pass: true, profileId: 'bankside-default', profileVersion: 1, demo: true,
      },
      {
        id: `demo-cal-do-${k}`, instrumentId: 'demo-meter-a', parameter: 'do', time: at(date, '08:00'), operator: CREW[1]!, kind: 'calibration',
        entries: { parameter: 'do', readingMgL: 9.0 + k * 0.02, tempC: 12.5, pressureKPa: 83.2, salinity: 0 },
        pass: true, profileId: 'bankside-default', profileVersion: 1, demo: true,
      },
    );
    visits.forEach((v, j) => {
      const time = at(date, v.hhmm);
      samples.push({
        id: `demo-sample-${k}-${j}`,
        siteId: v.site,
        time,
        crew: CREW,
        instrumentIds: ['demo-meter-a'],
        method: 'in-situ',
        flow: k === 2 ? 'rising' : 'normal',
        weather: k === 2 ? 'overcast after rain' : 'clear, light wind',
        pressure: { value: 832 + k, unit: 'hPa', source: 'station' },
        qc: { type: 'environmental' },
        field: {
          tempC: { values: series(v.temp, date, v.hhmm) },
          conductance: { mode: 'sc', unit: 'uS/cm', alpha: 0.0191, values: series(v.sc, date, v.hhmm) },
          pH: { values: series(v.pH, date, v.hhmm) },
          do: { unit: 'mg/L', values: series([v.doMgL], date, v.hhmm) },
          alkalinity: v.titration
            ? {
                kind: 'titration',
                titration: {
                  sampleVolumeMl: 100, titrantNormality: 1.6, correctionFactor: 1.0, equipment: 'digital-titrator', countsPerMl: 800, filtered: true,
                  points: DEMO_TITRATION_POINTS.map(([amount, pH]) => ({ amount, pH })),
                },
              }
            : { kind: 'direct', value: v.alk!, unit: 'mg/L CaCO3' },
          kits: [{ analyte: 'calcium', value: v.ca, unit: 'mg/L', step: 1 }],
          ions: v.extraIons ?? {},
        },
        remarks: v.remarks,
        demo: true,
      });
    });
  });
  // A field replicate of the first spring visit, linked to its parent.
  const rep = structuredClone(samples[0]!);
  rep.id = 'demo-sample-0-0-rep';
  rep.qc = { type: 'replicate', parentId: samples[0]!.id! };
  rep.remarks = 'Field replicate.';
  if (rep.field?.pH) rep.field.pH.values = rep.field.pH.values.map((x) => ({ ...x, value: x.value + 0.02 }));
  samples.push(rep);
  return { samples, calibrations };
}
