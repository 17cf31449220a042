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
 * 'auto': the extended Debye–Hückel equation (Kielland sizes) up to I = 0.05 mol/L, the
 * Truesdell–Jones equation from I = 0.1, and a linear blend of log γ in between
 * ({@link AUTO_BLEND}), so that no index steps where the model changes.
 * Why: against the mean-activity tables (Robinson & Stokes 1959, App. 8.10; from memory) both
 * agree within 0.005 in γ± for NaCl at 0.01 m; above 0.1 m Truesdell–Jones is far closer than
 * Davies (NaCl 0.5 m: table 0.681, TJ 0.675, Davies 0.733; KCl 0.5 m: table 0.649, TJ 0.643,
 * Davies 0.733) and it holds to about 2 mol/kg for NaCl-type water (Truesdell & Jones 1974).
 * The limiting law and Davies are therefore never chosen by 'auto' (both remain selectable).
 */
export const AUTO_BLEND = { fromI: 0.05, toI: 0.1 } as const;

/** Weight of Truesdell–Jones in 'auto' at ionic strength I (0 below 0.05 mol/L, 1 from 0.1). */
export function autoTjWeight(ionicStrength: number): number {
  const { fromI, toI } = AUTO_BLEND;
  if (ionicStrength <= fromI) return 0;
  if (ionicStrength >= toI) return 1;
  return (ionicStrength - fromI) / (toI - fromI);
}

/** The model that carries most weight in 'auto' at I (what a result reports as its model). */
export function chooseActivityModel(ionicStrength: number): ActivityModel {
  return autoTjWeight(ionicStrength) >= 0.5 ? 'truesdell-jones' : 'extended-debye-huckel';
}

/** log10 γ of an ion under 'auto' (blend of extended Debye–Hückel and Truesdell–Jones, see {@link AUTO_BLEND}). */
export function autoLogGamma(ion: Ion, I: number, terms: DebyeHuckelTerms): number {
  const w = autoTjWeight(I);
  if (w === 0) return logGammaFor(ion, I, terms, 'extended-debye-huckel');
  if (w === 1) return logGammaFor(ion, I, terms, 'truesdell-jones');
  return (1 - w) * logGammaFor(ion, I, terms, 'extended-debye-huckel') + w * logGammaFor(ion, I, terms, 'truesdell-jones');
}

/**
 * How much a model still counts as valid at I: 1 up to its {@link MODEL_MAX_IONIC_STRENGTH},
 * falling linearly to 0 at 1.5× that limit (so the spread of valid models has no step either).
 */
export function modelValidityWeight(model: ActivityModel, ionicStrength: number): number {
  const max = MODEL_MAX_IONIC_STRENGTH[model];
  if (ionicStrength <= max) return 1;
  return Math.max(0, 1 - (ionicStrength - max) / (0.5 * max));
}

/**
 * Doubt from the activity model about a sum of log γ (e.g. log γCa + log γCO3 for calcite):
 * the largest difference between the model used and any model valid at I, each weighted by
 * {@link modelValidityWeight} (the limiting law is their common low-I limit and is left out),
 * and never less than a floor for the model used itself.
 * Floor: Truesdell–Jones fits NaCl-type mean-activity tables within about 0.01 in log γ± to
 * 2 mol/kg but not sulfate-rich water (Truesdell & Jones 1974; Na₂SO₄ and MgSO₄ γ± in Robinson
 * & Stokes 1959, from memory): 0.01 per unit charge² per mol/L of I, our reading of those fits.
 * Returned as a ± half-width (log units); the caller treats it as a standard uncertainty, so
 * the 95 % band spans every valid model.
 */
export function activityModelDoubt(
  ions: ReadonlyArray<readonly [Ion, number]>,
  ionicStrength: number,
  terms: DebyeHuckelTerms,
  used: ActivityModel | 'auto',
): number {
  if (!(ionicStrength > 0)) return 0;
  const sum = (m: ActivityModel | 'auto') =>
    ions.reduce((s, [ion, nu]) => s + nu * (m === 'auto' ? autoLogGamma(ion, ionicStrength, terms) : logGammaFor(ion, ionicStrength, terms, m)), 0);
  const base = sum(used);
  let worst = 0;
  // The limiting law is the common low-I limit of the others, not a competing model: left out.
  for (const m of ACTIVITY_MODELS) {
    if (m === 'debye-huckel') continue;
    const w = modelValidityWeight(m, ionicStrength);
    if (w > 0) worst = Math.max(worst, w * Math.abs(sum(m) - base));
  }
  const z2 = ions.reduce((s, [ion, nu]) => s + Math.abs(nu) * SPECIES[ion].charge * SPECIES[ion].charge, 0);
  return Math.max(worst, 0.01 * z2 * ionicStrength);
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
