import { InputError, present, requireRange } from './errors';
import { SPECIES, isIon, type Ion } from './species';
import { debyeHuckelA, debyeHuckelB } from './water';

export type ActivityModel = 'debye-huckel' | 'extended-debye-huckel' | 'davies' | 'truesdell-jones';
export const ACTIVITY_MODELS: readonly ActivityModel[] = ['debye-huckel', 'extended-debye-huckel', 'davies', 'truesdell-jones'];

/**
 * Upper ionic strength (mol/L) to which each model is commonly held to be adequate for
 * natural waters (common practice; see Stumm & Morgan, Aquatic Chemistry, table of activity
 * coefficient approximations; Truesdell & Jones 1974 for their equation):
 * limiting law ≲ 0.005; extended Debye–Hückel ≲ 0.1; Davies ≲ 0.5; Truesdell–Jones ≲ 2 for
 * NaCl-dominated water.
 */
export const MODEL_MAX_IONIC_STRENGTH: Record<ActivityModel, number> = {
  'debye-huckel': 0.005,
  'extended-debye-huckel': 0.1,
  davies: 0.5,
  'truesdell-jones': 2,
};

/**
 * The model 'auto' uses at ionic strength I (mol/L): the limiting law below 0.001 (where it
 * agrees with the extended form to better than 0.01 in log γ for divalent ions), extended
 * Debye–Hückel to 0.1, Davies to 0.5, Truesdell–Jones above. Our choice, documented in DEVELOPERS.md.
 */
export function chooseActivityModel(ionicStrength: number): ActivityModel {
  if (ionicStrength < 0.001) return 'debye-huckel';
  if (ionicStrength <= 0.1) return 'extended-debye-huckel';
  if (ionicStrength <= 0.5) return 'davies';
  return 'truesdell-jones';
}

/** Precomputed temperature terms, so a speciation loop does not redo them. */
export interface DebyeHuckelTerms {
  A: number;
  B: number;
}

export function debyeHuckelTerms(tempC: number): DebyeHuckelTerms {
  return { A: debyeHuckelA(tempC), B: debyeHuckelB(tempC) };
}

/**
 * log10 γ of a species of charge z, with the model's ion-size parameters, at ionic strength I.
 * - limiting law: log γ = −A z² √I
 * - extended Debye–Hückel: log γ = −A z² √I / (1 + B å √I)              (å: Kielland 1937)
 * - Davies: log γ = −A z² (√I/(1 + √I) − 0.3 I)                           (Davies 1962)
 * - Truesdell–Jones: log γ = −A z² √I / (1 + B a √I) + b I               (Truesdell & Jones 1974)
 * Neutral species: log γ = 0 (salting-out neglected; an error below 0.01 at I < 0.1, common practice).
 */
export function logGammaFor(ion: Ion, I: number, terms: DebyeHuckelTerms, model: ActivityModel): number {
  const s = SPECIES[ion];
  const z2 = s.charge * s.charge;
  if (z2 === 0 || I <= 0) return 0;
  const sqrtI = Math.sqrt(I);
  switch (model) {
    case 'debye-huckel':
      return -terms.A * z2 * sqrtI;
    case 'extended-debye-huckel':
      return (-terms.A * z2 * sqrtI) / (1 + terms.B * s.kiellandA * sqrtI);
    case 'davies':
      return -terms.A * z2 * (sqrtI / (1 + sqrtI) - 0.3 * I);
    case 'truesdell-jones': {
      const tj = 'tj' in s ? s.tj : undefined;
      const a = tj ? tj.a : s.kiellandA;
      const b = tj ? tj.b : 0;
      return (-terms.A * z2 * sqrtI) / (1 + terms.B * a * sqrtI) + b * I;
    }
  }
}

/**
 * Activity coefficient γ (not its log) of an ion.
 * @param ion one of the engine's species keys ('H','OH','Na','K','Ca','Mg','Cl','SO4','HCO3','CO3','NO3','F', …)
 * @param ionicStrength I in mol/L (≈ mol/kg in fresh water), ≥ 0
 * @param tempC water temperature, 0–100 °C
 * @param model one of the four activity models
 * Sources per model: see {@link logGammaFor}. Beyond a model's range the value is still
 * returned (the caller warns: {@link MODEL_MAX_IONIC_STRENGTH}); I above 10 mol/L is refused.
 */
export function activityCoefficient(ion: string, ionicStrength: number, tempC: number, model: ActivityModel): number {
  if (!isIon(ion)) throw new InputError('ion', `Unknown ion '${ion}'. Known: ${Object.keys(SPECIES).join(', ')}.`);
  if (!present('ionicStrength', ionicStrength)) throw new InputError('ionicStrength', 'ionicStrength is required.');
  requireRange('ionicStrength', ionicStrength, 0, 10, 'mol/L');
  if (!(ACTIVITY_MODELS as readonly string[]).includes(model)) {
    throw new InputError('model', `Unknown activity model '${String(model)}'.`);
  }
  return Math.pow(10, logGammaFor(ion, ionicStrength, debyeHuckelTerms(tempC), model));
}

/**
 * Mean activity coefficient of a salt from its ions' single-ion values:
 * log γ± = (ν₊ log γ₊ + ν₋ log γ₋)/(ν₊ + ν₋). For comparison with measured γ± tables.
 */
export function meanActivityCoefficient(
  cation: Ion,
  anion: Ion,
  ionicStrength: number,
  tempC: number,
  model: ActivityModel,
): number {
  const zc = SPECIES[cation].charge;
  const za = -SPECIES[anion].charge;
  const nuC = za, nuA = zc; // electroneutral formula CaCl2: ν+ = 1 (|z-|=1 … scaled by gcd below)
  const g = gcd(nuC, nuA);
  const t = debyeHuckelTerms(tempC);
  const lc = logGammaFor(cation, ionicStrength, t, model);
  const la = logGammaFor(anion, ionicStrength, t, model);
  return Math.pow(10, ((nuC / g) * lc + (nuA / g) * la) / (nuC / g + nuA / g));
}

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}
