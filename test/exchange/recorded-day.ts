// A recorded (non-demo) field day, built in the test: three invented sites (one in NAD83), a stream
// sample with raw EC, DO in %, a buret titration, kits and lab results (one censored); its field
// replicate; a field blank with censored lab values; a spring with one reading each and qualifiers;
// a well with typed ions and lab SC/pH. All values invented, shaped like real field sheets.
import { Sample, Site } from '../../src/records/schema';
import { titrationCurve } from '../chemistry/titration-curve';

const T = '2026-07-09T17:00:00-06:00';
const meta = { createdAt: T, updatedAt: T };
const IMPORTED = '2026-07-20T10:00:00-06:00';

export const RECORDED_SITES = [
  { id: 'rs-tc01', code: 'TC-01', name: 'Tamarack Creek at the county road', type: 'stream', latitude: 44.123456, longitude: -107.234567, datum: 'NAD83', accuracyM: 3, elevationM: 1820.4 },
  { id: 'rs-spr', code: 'TC-SPR', name: 'Tamarack seep spring', type: 'spring', latitude: 44.130012, longitude: -107.2401, datum: 'WGS84', accuracyM: 6 },
  { id: 'rs-w2', code: 'TC-W2', name: 'Ranch well 2', type: 'well', latitude: 44.1011, longitude: -107.2003, datum: 'WGS84' },
].map((s) => Site.parse({ ...s, ...meta }));

const at = (hhmm: string, plusS = 0) => {
  const [h, m] = hhmm.split(':').map(Number);
  // the site's own wall clock, written with its offset −06:00 (MDT)
  return `${new Date(Date.UTC(2026, 6, 9, h!, m!, plusS)).toISOString().slice(0, 19)}-06:00`;
};
const series = (hhmm: string, values: number[]) => values.map((value, i) => ({ time: at(hhmm, i * 30), value }));
// older records (before censored storage) kept a limit as the value with a U / ND qualifier: the blank uses that form
const lab = (parameter: string, value: number, unit: string, extra: Record<string, string> = {}) => ({ parameter, value, unit, importedAt: IMPORTED, labSampleId: 'L26-0412', ...extra });

// 50 mL titrated with 0.02 N acid by buret; alkalinity 3.44 meq/L (172 mg/L as CaCO3) at 11.4 °C
const curve = titrationCurve({ sampleMl: 50, alkMeqL: 3.44, initialPH: 7.88, normality: 0.02, tempC: 11.4, volumesMl: [0, 2, 4, 6, 7, 7.5, 8, 8.2, 8.4, 8.6, 8.8, 9, 9.5, 10, 11], noise: 0.01, seed: 7 });

const stream = {
  id: 'rec-1', siteId: 'rs-tc01', time: at('08:12'), timeZone: 'America/Denver', crew: ['A. Okafor', 'L. Brandt'], method: 'in-situ', flow: 'normal',
  pressure: { value: 81.9, unit: 'kPa', source: 'station' },
  field: {
    tempC: { values: series('08:12', [11.42, 11.38, 11.4, 11.41, 11.39, 11.4]) },
    conductance: { mode: 'ec', unit: 'uS/cm', tempC: 11.4, alpha: 0.0191, values: series('08:12', [371, 369.5, 370, 370.2, 369.8]) },
    pH: { values: series('08:12', [7.91, 7.88, 7.87, 7.88, 7.87]) },
    do: { unit: '%', values: series('08:12', [98.2, 97.9, 98.0, 98.1, 98.0]) },
    alkalinity: { kind: 'titration', titration: { sampleVolumeMl: 50, titrantNormality: 0.02, equipment: 'buret', filtered: true, points: curve.map((p) => ({ amount: p.titrantMl, pH: p.pH })) } },
    kits: [
      { analyte: 'calcium-hardness', value: 141.2, unit: 'mg/L CaCO3', step: 0.4, fraction: 'dissolved' },
      { analyte: 'total-hardness', value: 188, unit: 'mg/L CaCO3', step: 4 },
    ],
    ions: { clMgL: 4.1, so4MgL: 38.5, no3NMgL: 0.42, nh3nh4NMgL: 0.05 },
  },
  lab: [
    lab('Calcium', 56.1, 'mg/L', { method: 'EPA 200.7' }),
    lab('Magnesium', 11.7, 'mg/L'),
    lab('Sodium', 8.9, 'mg/L'),
    lab('Potassium', 1.6, 'mg/L'),
    lab('Chloride', 4.3, 'mg/L', { method: 'EPA 300.0' }),
    lab('Sulfate', 39.1, 'mg/L'),
    lab('Alkalinity as CaCO3', 172, 'mg/L as CaCO3', { method: 'SM 2320 B' }),
    // stored as the lab import stores "<0.05 U": censored, with its detection limit and no value
    { parameter: 'Nitrate as N', censored: true, detectionLimit: 0.05, unit: 'mg/l as N', unitUcum: 'mg{N}/L', qualifier: 'U', importedAt: IMPORTED, labSampleId: 'L26-0412' },
  ],
  remarks: 'Riffle below the culvert.',
};

const replicate = {
  ...structuredClone(stream),
  id: 'rec-2', time: at('08:31'), qc: { type: 'replicate', parentId: 'rec-1' }, remarks: 'Field replicate, second bottle.',
  lab: [lab('Calcium', 55.4, 'mg/L', { method: 'EPA 200.7' })],
};
replicate.field.pH.values = series('08:31', [7.9, 7.89, 7.89, 7.9, 7.89]);

const blank = {
  id: 'rec-3', siteId: 'rs-tc01', time: at('09:05'), timeZone: 'America/Denver', method: 'grab', qc: { type: 'blank' },
  field: {
    tempC: { values: series('09:05', [18.2]) },
    conductance: { mode: 'sc', unit: 'uS/cm', values: series('09:05', [1.4, 1.3, 1.3]) },
    pH: { values: series('09:05', [5.81, 5.78, 5.79]) },
    kits: [{ analyte: 'calcium', value: 0, unit: 'mg/L', step: 1 }],
  },
  lab: [lab('Calcium', 0.05, 'mg/L', { qualifier: 'U' }), lab('Chloride', 0.1, 'mg/L', { qualifier: 'ND' })],
  remarks: 'Deionised water poured through the sampler at the bank.',
};

const spring = {
  id: 'rec-4', siteId: 'rs-spr', time: at('10:40'), timeZone: 'America/Denver', method: 'grab',
  field: {
    tempC: { values: series('10:40', [8.9]) },
    conductance: { mode: 'sc', unit: 'uS/cm', values: series('10:40', [512]) },
    pH: { values: series('10:40', [7.079999999999999]) },
    do: { unit: 'mg/L', values: series('10:40', [4.31]) },
    alkalinity: { kind: 'direct', value: 248, unit: 'mg/L CaCO3' },
    kits: [{ analyte: 'calcium', value: 88, unit: 'mg/L', step: 2 }],
  },
  qualifiers: ['estimated', 'unstable'],
  remarks: 'Orifice half buried; pH drifting.',
};

const well = {
  id: 'rec-5', siteId: 'rs-w2', time: at('13:15'), timeZone: 'America/Denver', method: 'flow-through',
  field: {
    tempC: { values: series('13:15', [12.05, 12.1, 12.1, 12.1, 12.1]) },
    conductance: { mode: 'sc', unit: 'uS/cm', values: series('13:15', [846, 845, 845, 844, 845]) },
    pH: { values: series('13:15', [7.31, 7.33, 7.33, 7.34, 7.33]) },
    do: { unit: 'mg/L', values: series('13:15', [0.41, 0.38, 0.37, 0.37, 0.36]) },
    alkalinity: { kind: 'direct', value: 3.36, unit: 'meq/L' },
    kits: [{ analyte: 'calcium', value: 2.1, unit: 'mmol/L' }, { analyte: 'magnesium', value: 21, unit: 'mg/L' }],
    ions: { naMgL: 45.2, kMgL: 3.1, fMgL: 0.62, sio2MgL: 18.4, tdsMgL: 540 },
  },
  lab: [lab('Specific conductance', 851, 'uS/cm @25C'), lab('pH', 7.35, 'std units')],
};

export const RECORDED_SAMPLES = [stream, replicate, blank, spring, well].map((s) => Sample.parse({ ...s, ...meta, localDate: s.time.slice(0, 10) }));
