// The record schemas: the single source of the stored types (z.infer below). Raw field entries are
// stored as entered (raw EC with its temperature and α, every repeated reading with its time, every
// titration point); computed indicators are derived from them by the engine and never stored as truth.
import { z } from 'zod';
import { isoTimeProblem, localDateProblem, samplingTimeProblem } from './time';

// The app runs under a Content-Security-Policy without 'unsafe-eval': zod's fast path probes
// `new Function`, which the browser reports as a policy violation. The plain path is used instead.
z.config({ jitless: true });

/**
 * ISO 8601 date-time with an explicit UTC offset (or Z) that is a real instant: hour 25, minute 61
 * or 30 February are refused with the reason (records/time.ts isoTimeProblem, the one rule).
 */
export const IsoDateTime = z.string().check((ctx) => {
  const problem = isoTimeProblem(ctx.value);
  if (problem) ctx.issues.push({ code: 'custom', message: problem, input: ctx.value });
});
/** A sample's own time: a real instant (IsoDateTime) in a year a sample can have (not the picker slip 0025). */
export const SamplingTime = z.string().check((ctx) => {
  const problem = samplingTimeProblem(ctx.value);
  if (problem) ctx.issues.push({ code: 'custom', message: problem, input: ctx.value });
});
export const LocalDate = z.string().check((ctx) => {
  const problem = localDateProblem(ctx.value);
  if (problem) ctx.issues.push({ code: 'custom', message: problem, input: ctx.value });
});
const Id = z.string().min(1).max(100);
const Finite = z.number().refine(Number.isFinite, { error: 'Must be a finite number' });

/** Fields every stored entity carries. */
const Meta = {
  id: Id,
  createdAt: IsoDateTime,
  updatedAt: IsoDateTime,
  /** soft delete: set when deleted, removed on undo */
  deletedAt: IsoDateTime.optional(),
  /** part of the invented demo scenario (removable in one step) */
  demo: z.boolean().optional(),
};

/** One hand-over of the day's samples (chain of custody): who gave them, who took them, when, how cold. */
export const CustodyTransfer = z.object({
  id: Id,
  relinquishedBy: z.string().min(1).max(100),
  receivedBy: z.string().min(1).max(100),
  time: IsoDateTime,
  /** cooler (or temperature blank) at hand-over, °C */
  coolerTempC: Finite.min(-30).max(60).optional(),
  remarks: z.string().max(1000).default(''),
});

export const FieldDay = z.object({
  ...Meta,
  date: LocalDate,
  /** the meters used this day: every new sample of the day links to them */
  instrumentIds: z.array(Id).optional(),
  /** chain-of-custody hand-overs of the day's samples, in order */
  custody: z.array(CustodyTransfer).optional(),
  project: z.string().max(200).default(''),
  crew: z.array(z.string().max(100)).default([]),
  lead: z.string().max(100).optional(),
  notes: z.string().max(4000).default(''),
});

export const Site = z.object({
  ...Meta,
  code: z.string().min(1).max(40),
  name: z.string().min(1).max(200),
  type: z.enum(['stream', 'spring', 'well', 'lake', 'other']),
  latitude: Finite.min(-90).max(90).optional(),
  longitude: Finite.min(-180).max(180).optional(),
  datum: z.string().max(40).default('WGS84'),
  /** horizontal accuracy of the position, m (from the phone's GPS or the survey) */
  accuracyM: Finite.min(0).optional(),
  elevationM: Finite.optional(),
  notes: z.string().max(4000).default(''),
  /** the office's visiting order for a sampling run (1 = first); the day view offers the next unvisited */
  runOrder: z.number().int().min(0).max(100000).optional(),
});

export const Instrument = z.object({
  ...Meta,
  name: z.string().min(1).max(100),
  make: z.string().max(100).default(''),
  model: z.string().max(100).default(''),
  serial: z.string().max(100).default(''),
  sensors: z.array(z.enum(['temperature', 'pH', 'sc', 'do', 'turbidity'])).default([]),
  notes: z.string().max(4000).default(''),
});

export const TimedValue = z.object({ time: IsoDateTime, value: Finite });

/** A repeated reading of one parameter: every value with its time, as entered. */
export const RepeatedReading = z.object({
  values: z.array(TimedValue).min(1),
  /** why the crew reported a value although the readings did not stabilize */
  override: z.string().max(500).optional(),
});

export const Conductance = z.object({
  /** 'ec': raw conductivity at the water's temperature; 'sc': the meter already reports SC at 25 °C */
  mode: z.enum(['ec', 'sc']),
  values: z.array(TimedValue).min(1),
  /** µS/cm always (the form converts mS/cm) */
  unit: z.literal('uS/cm'),
  /** temperature of the EC reading, °C (mode 'ec') */
  tempC: Finite.optional(),
  /** linear compensation coefficient, /°C */
  alpha: Finite.min(0).max(0.05).default(0.0191),
});

export const TitrationRecord = z.object({
  sampleVolumeMl: Finite.positive(),
  titrantNormality: Finite.positive(),
  correctionFactor: Finite.positive().default(1),
  equipment: z.enum(['buret', 'digital-titrator']),
  countsPerMl: Finite.positive().default(800),
  filtered: z.boolean().default(true),
  points: z
    .array(z.object({ amount: Finite.min(0), pH: Finite.min(0).max(14) }))
    .min(2),
});

export const Alkalinity = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('direct'), value: Finite.min(0), unit: z.enum(['mg/L CaCO3', 'meq/L', 'mg/L HCO3']) }),
  z.object({ kind: z.literal('titration'), titration: TitrationRecord }),
]);

/**
 * An analytical method as the WQX lists it: its identifier and the body that publishes it
 * (e.g. 3500-CA(B) / APHA, 300.0 / USEPA, 8203 / HACH).
 */
export const MethodRef = z.object({ id: z.string().min(1).max(35), context: z.string().min(1).max(32) });
/** Which part of the water a result is of: unfiltered ('total') or passed through a filter ('dissolved'). */
export const SampleFraction = z.enum(['total', 'dissolved']);

export const KitResult = z.object({
  analyte: z.enum(['calcium', 'calcium-hardness', 'total-hardness', 'magnesium', 'ammonia-n', 'chloride', 'sulfate']),
  value: Finite.min(0),
  unit: z.enum(['mg/L', 'mg/L CaCO3', 'mmol/L', 'meq/L']),
  /** the kit's smallest step, same unit: carried into the uncertainty */
  step: Finite.min(0).optional(),
  /** filtered water or not; when absent, the kit's default (records/methods.ts) */
  fraction: SampleFraction.optional(),
  /** the kit's method; when absent, the usual method of that kit type (records/methods.ts) */
  method: MethodRef.optional(),
});

/** Optional extra ions entered in the field, mg/L (the engine's names). */
export const FieldIons = z.object({
  mgMgL: Finite.min(0).optional(),
  naMgL: Finite.min(0).optional(),
  kMgL: Finite.min(0).optional(),
  clMgL: Finite.min(0).optional(),
  so4MgL: Finite.min(0).optional(),
  no3NMgL: Finite.min(0).optional(),
  fMgL: Finite.min(0).optional(),
  sio2MgL: Finite.min(0).optional(),
  tdsMgL: Finite.min(0).optional(),
  nh3nh4NMgL: Finite.min(0).optional(),
});

/**
 * A laboratory result, kept apart from field values and never overwriting them. A censored result
 * ("<0.05", "ND", a U qualifier) has no value: `censored` with the lab's detection limit.
 */
export const LabResult = z.object({
  parameter: z.string().min(1).max(60),
  value: Finite.optional(),
  censored: z.literal(true).optional(),
  detectionLimit: Finite.min(0).optional(),
  /** the unit as the lab wrote it */
  unit: z.string().max(30),
  /** the same unit as a UCUM code (basis as an annotation: mg{N}/L), when recognised */
  unitUcum: z.string().max(40).optional(),
  labSampleId: z.string().max(100).optional(),
  method: z.string().max(200).optional(),
  qualifier: z.string().max(20).optional(),
  /** sample fraction the lab analysed; when absent, the parameter's default (records/methods.ts) */
  fraction: SampleFraction.optional(),
  /** the lab's method as the WQX lists it; when absent, read from `method` or the parameter's default */
  analyticalMethod: MethodRef.optional(),
  importedAt: IsoDateTime,
}).refine((l) => (l.value === undefined) === (l.censored === true), { error: 'A lab result has either a value or is censored (not detected)' });

export const QcType = z.enum(['environmental', 'replicate', 'blank']);
export const Qualifier = z.enum(['estimated', 'unstable', 'outside-calibration', 'suspect']);

export const Sample = z.object({
  ...Meta,
  /** the short ID written on the bottle and used as the WQX Activity ID (≤ 35 characters, unique on the device;
   * given by the store at the first save, kept through edits; see records/sample-code.ts) */
  sampleCode: z.string().min(1).max(35).regex(/^[A-Za-z0-9][A-Za-z0-9-]*$/, { error: 'A sample code holds letters, digits and hyphens only' }).optional(),
  siteId: Id,
  fieldDayId: Id.optional(),
  /** sampling time with its UTC offset */
  time: SamplingTime,
  /** the IANA time zone the sample was recorded in (e.g. America/Denver), stored with each new sample */
  timeZone: z.string().max(64).optional(),
  /** the local calendar date of `time` (index for "the day's samples") */
  localDate: LocalDate,
  crew: z.array(z.string().max(100)).default([]),
  instrumentIds: z.array(Id).default([]),
  method: z.enum(['in-situ', 'flow-through', 'grab']).default('in-situ'),
  flow: z.enum(['low', 'normal', 'high', 'rising', 'falling', 'dry', 'unknown']).default('unknown'),
  weather: z.string().max(500).default(''),
  appearance: z.string().max(500).default(''),
  pressure: z.object({ value: Finite.positive(), unit: z.enum(['hPa', 'kPa', 'mmHg']), source: z.enum(['station', 'sea-level', 'estimated']) }).optional(),
  qc: z.object({ type: QcType, parentId: Id.optional() }).default({ type: 'environmental' }),
  field: z
    .object({
      tempC: RepeatedReading.optional(),
      conductance: Conductance.optional(),
      pH: RepeatedReading.optional(),
      do: RepeatedReading.extend({ unit: z.enum(['mg/L', '%']) }).optional(),
      alkalinity: Alkalinity.optional(),
      kits: z.array(KitResult).default([]),
      ions: FieldIons.default({}),
    })
    .default({ kits: [], ions: {} }),
  lab: z.array(LabResult).default([]),
  remarks: z.string().max(4000).default(''),
  qualifiers: z.array(Qualifier).default([]),
  profileId: z.string().default('bankside-default'),
  profileVersion: z.number().int().min(1).default(1),
  /** counts saved edits; revision history holds each change */
  revision: z.number().int().min(1).default(1),
  createdBy: z.string().max(100).default(''),
});

export const CalibrationEvent = z.object({
  ...Meta,
  instrumentId: Id,
  parameter: z.enum(['pH', 'sc', 'do', 'temperature']),
  time: IsoDateTime,
  localDate: LocalDate,
  operator: z.string().max(100).default(''),
  kind: z.enum(['calibration', 'check']).default('calibration'),
  /** what was measured, as entered */
  entries: z.discriminatedUnion('parameter', [
    z.object({ parameter: z.literal('pH'), buffers: z.array(z.object({ bufferPH: Finite, mV: Finite, tempC: Finite, lot: z.string().optional() })).min(1) }),
    z.object({ parameter: z.literal('sc'), standardUsPerCm: Finite.positive(), readingUsPerCm: Finite.min(0), tempC: Finite.optional(), lot: z.string().optional(), expiry: LocalDate.optional() }),
    z.object({ parameter: z.literal('do'), readingMgL: Finite.min(0), tempC: Finite, pressureKPa: Finite.positive(), salinity: Finite.min(0).default(0) }),
    z.object({ parameter: z.literal('temperature'), referenceC: Finite, readingC: Finite }),
  ]),
  /** verdict at the time, with the profile it used (recomputable from entries) */
  pass: z.boolean(),
  profileId: z.string(),
  profileVersion: z.number().int().min(1),
  remarks: z.string().max(2000).default(''),
});

export const Revision = z.object({
  id: Id,
  entity: z.enum(['sample', 'site', 'calibration', 'instrument', 'fieldDay']),
  entityId: Id,
  at: IsoDateTime,
  /** strictly increasing order of revisions made on this device (ms × 1000 + counter) */
  seq: z.number().int().min(0),
  by: z.string().max(100),
  action: z.enum(['create', 'update', 'delete', 'restore', 'import']),
  /** field paths that changed, with before and after values */
  changes: z.array(z.object({ path: z.string(), from: z.unknown(), to: z.unknown() })),
});

export const Settings = z.object({
  id: z.literal('settings'),
  operator: z.string().max(100).default(''),
  activityModel: z.enum(['auto', 'debye-huckel', 'extended-debye-huckel', 'davies', 'truesdell-jones']).default('auto'),
  conductanceFactor: Finite.min(5e-6).max(3e-5).default(1.5e-5),
  profileId: z.string().default('bankside-default'),
  /** WQX Project ID the exports carry (≤ 35 characters) */
  projectId: z.string().max(35).default(''),
  /** WQX Organization ID the exports carry */
  organizationId: z.string().max(120).default(''),
  units: z
    .object({
      alkalinity: z.enum(['mg/L CaCO3', 'meq/L', 'mg/L HCO3']).default('mg/L CaCO3'),
      conductance: z.enum(['uS/cm', 'mS/cm']).default('uS/cm'),
      pressure: z.enum(['hPa', 'kPa', 'mmHg']).default('hPa'),
      do: z.enum(['mg/L', '%']).default('mg/L'),
    })
    .default({ alkalinity: 'mg/L CaCO3', conductance: 'uS/cm', pressure: 'hPa', do: 'mg/L' }),
  office: z
    .object({ endpoint: z.string().max(2000).default(''), token: z.string().max(2000).default(''), method: z.enum(['POST', 'PUT']).default('POST') })
    .default({ endpoint: '', token: '', method: 'POST' }),
});

/** Unsaved form state, stored raw (strings as typed) so nothing typed is lost. */
export const Draft = z.object({
  id: Id,
  kind: z.enum(['sample', 'calibration', 'site']),
  /** the record being edited, if any */
  targetId: Id.optional(),
  /** the stored revision the edit started from (a save over a newer one asks first) */
  baseRevision: z.number().int().min(1).optional(),
  form: z.record(z.string(), z.unknown()),
  updatedAt: IsoDateTime,
});

export const OutboxItem = z.object({
  id: Id,
  /** sent as Idempotency-Key: a retry never makes a second copy at the office */
  idempotencyKey: z.string().min(8),
  createdAt: IsoDateTime,
  status: z.enum(['queued', 'sending', 'sent', 'failed']),
  attempts: z.number().int().min(0),
  nextAttemptAt: IsoDateTime.optional(),
  lastError: z.string().max(2000).optional(),
  sentAt: IsoDateTime.optional(),
  fileName: z.string().max(200),
  contentType: z.string().max(100),
  body: z.string(),
  sampleIds: z.array(Id),
  /** every file of the selection, sent as one batch (older items carry one file in fileName/body) */
  files: z.array(z.object({ fileName: z.string().min(1).max(200), contentType: z.string().max(100), body: z.string() })).optional(),
  /** PUT to storage: files the storage has confirmed (a retry sends only the others) */
  delivered: z.array(z.string().max(200)).optional(),
  /** what went wrong on the last try, as a kind the status words are chosen by */
  problem: z.enum(['server-error', 'refused', 'no-connection', 'cors', 'redirect', 'not-confirmed', 'timeout']).optional(),
  /** the HTTP status of the last answer, if any */
  lastStatus: z.number().int().optional(),
});

export const ExportLogEntry = z.object({
  id: Id,
  at: IsoDateTime,
  kind: z.enum(['csv-wide', 'csv-long', 'csv-calibrations', 'csv-titrations', 'geojson', 'wqx-results', 'wqx-locations', 'backup', 'upload']),
  fileName: z.string().max(200),
  sampleIds: z.array(Id),
  engineVersion: z.string(),
});

export type FieldDay = z.infer<typeof FieldDay>;
export type CustodyTransfer = z.infer<typeof CustodyTransfer>;
export type Site = z.infer<typeof Site>;
export type Instrument = z.infer<typeof Instrument>;
export type TimedValue = z.infer<typeof TimedValue>;
export type Sample = z.infer<typeof Sample>;
export type KitResult = z.infer<typeof KitResult>;
export type LabResult = z.infer<typeof LabResult>;
export type CalibrationEvent = z.infer<typeof CalibrationEvent>;
export type Revision = z.infer<typeof Revision>;
export type Settings = z.infer<typeof Settings>;
export type Draft = z.infer<typeof Draft>;
export type OutboxItem = z.infer<typeof OutboxItem>;
export type ExportLogEntry = z.infer<typeof ExportLogEntry>;
export type TitrationRecord = z.infer<typeof TitrationRecord>;
export type MethodRef = z.infer<typeof MethodRef>;
export type SampleFraction = z.infer<typeof SampleFraction>;

export { DEFAULT_SETTINGS } from './defaults';
