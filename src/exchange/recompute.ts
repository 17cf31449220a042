// The office side: re-run every indicator and data check on an exported samples CSV (optionally
// joined with a lab-results CSV), with the same engine the phones use. Runs in Node.
import { analyzeSample, dataChecks, DEFAULT_PROFILE, ENGINE_VERSION, InputError, PRESSURE_TO_KPA, specificConductance, type AnalyzeOptions, type SampleInput } from '../chemistry';
import { parseCsv, toCsv, unsafeCell, type Cell } from './csv';
import { parseDecimalLoose } from '../records/numbers';
import { LAB_PARAMS } from '../records/site-factor';


const FIELD_COLUMNS: Array<[keyof SampleInput, string]> = [
  ['tempC', 'water_temp_degC'], ['pH', 'ph_field'], ['alkalinityMgLCaCO3', 'alkalinity_mg_L_CaCO3'], ['caMgL', 'ca_mg_L'],
  ['mgMgL', 'mg_mg_L'], ['naMgL', 'na_mg_L'], ['kMgL', 'k_mg_L'], ['clMgL', 'cl_mg_L'], ['so4MgL', 'so4_mg_L'],
  ['no3NMgL', 'no3_mg_L_as_N'], ['fMgL', 'f_mg_L'], ['sio2MgL', 'sio2_mg_L'], ['tdsMgL', 'tds_mg_L'],
];

export const OFFICE_COLUMNS = [
  'office_engine_version', 'office_sc_uS_cm_25C', 'office_ionic_strength_mol_L', 'office_ionic_strength_source', 'office_activity_model',
  'office_si_calcite', 'office_si_calcite_band_95pct', 'office_calcite_state', 'office_log_pco2_atm', 'office_langelier_index',
  'office_charge_balance_pct', 'office_charge_balance_ok', 'office_sc_calculated_uS_cm', 'office_do_saturation_pct', 'office_lab_values_used',
  'office_checks_failed', 'office_flags', 'office_differs_from_field', 'office_error',
];

export function recomputeCsv(samplesCsv: string, labCsv?: string, options: AnalyzeOptions = {}): string {
  const { header, rows, errors } = parseCsv(samplesCsv);
  if (errors.length > 0) throw new Error(`The samples file is not valid CSV: ${errors.slice(0, 3).join('; ')}`);
  if (!header.includes('sample_id')) throw new Error('The samples file has no sample_id column: is it a Bankside samples CSV?');
  const lab = new Map<string, Partial<Record<keyof SampleInput, number>>>();
  if (labCsv) {
    const l = parseCsv(labCsv);
    for (const r of l.rows) {
      const field = LAB_PARAMS[(r.parameter ?? '').trim().toLowerCase()];
      const v = parseDecimalLoose(r.value ?? '');
      const unit = (r.unit ?? r.unit_ucum ?? '').replace(/\s/g, '').toLowerCase();
      if (!field || v === undefined || (unit && unit !== 'mg/l')) continue;
      const id = (r.sample_id ?? '').trim();
      lab.set(id, { ...lab.get(id), [field]: v });
    }
  }
  const out: Cell[][] = rows.map((r) => {
    const input: Record<string, number> = {};
    for (const [key, col] of FIELD_COLUMNS) {
      const v = parseDecimalLoose(unsafeCell(r[col] ?? ''));
      if (v !== undefined) input[key] = v;
    }
    const sc = parseDecimalLoose(r.sc_field_uS_cm_25C ?? '');
    const ec = parseDecimalLoose(r.ec_raw_uS_cm ?? '');
    try {
      if (sc !== undefined) input.scUsPerCm = sc;
      else if (ec !== undefined) {
        const t = parseDecimalLoose(r.ec_temp_degC ?? '') ?? input.tempC;
        if (t !== undefined) input.scUsPerCm = specificConductance(ec, t, parseDecimalLoose(r.ec_alpha_per_degC ?? '') ?? 0.0191);
      }
      const used: string[] = [];
      for (const [k, v] of Object.entries(lab.get(r.sample_id ?? '') ?? {})) {
        if (input[k] === undefined && v !== undefined) {
          input[k] = v;
          used.push(k);
        }
      }
      // DO and pressure go to the engine, which corrects saturation for salinity (from SC) and pressure
      const dox = parseDecimalLoose(r.do_field ?? '');
      if (dox !== undefined) input[(r.do_field_unit ?? '').trim() === '%' ? 'doPercent' : 'doMgL'] = dox;
      const p = parseDecimalLoose(r.pressure ?? ''), pUnit = (r.pressure_unit ?? '').trim() as keyof typeof PRESSURE_TO_KPA;
      if (p !== undefined && pUnit in PRESSURE_TO_KPA) input.pressureKPa = p * PRESSURE_TO_KPA[pUnit];
      if (input.tempC === undefined) throw new InputError('tempC', 'no water temperature in the row');
      const a = analyzeSample(input as unknown as SampleInput, options);
      const checks = dataChecks(input as unknown as SampleInput, a, DEFAULT_PROFILE);
      const fieldSi = parseDecimalLoose(r.si_calcite ?? '');
      const differs = fieldSi !== undefined && a.saturationIndex.calcite !== undefined ? Math.abs(fieldSi - a.saturationIndex.calcite) > 0.01 : undefined;
      return [
        ...header.map((h) => r[h]),
        ENGINE_VERSION, input.scUsPerCm, a.ionicStrength.value, a.ionicStrength.source, a.activityModel,
        a.saturationIndex.calcite, a.calciteSiUncertainty, a.calciteState, a.logPco2, a.langelier?.lsi,
        a.chargeBalancePercent, a.chargeBalance?.acceptable, a.calculatedScUsPerCm, a.oxygen?.percentSaturation, used.join('; '),
        checks.filter((c) => c.status === 'fail').map((c) => c.id).join('; '),
        [...new Set(a.warnings.map((w) => w.code))].join('; '),
        differs === undefined ? '' : differs ? 'yes' : 'no',
        '',
      ];
    } catch (e) {
      return [...header.map((h) => r[h]), ENGINE_VERSION, ...OFFICE_COLUMNS.slice(1, -1).map(() => ''), e instanceof Error ? e.message : String(e)];
    }
  });
  // header cells were already neutralised by the exporter: pass them through as read
  return toCsv([...header, ...OFFICE_COLUMNS], out.map((row) => row.map((c) => (typeof c === 'string' ? unsafeCell(c) : c))));
}
