/**
 * Anion–cation balance, Standard Methods 1030 E (acceptance criteria from memory; verify
 * against your edition): % difference = 100 (Σcations − Σanions)/(Σcations + Σanions), sums in
 * meq/L. Acceptance by anion sum: 0–3 meq/L → |Σcations − Σanions| ≤ 0.2 meq/L;
 * 3–10 meq/L → ±2 %; 10–800 meq/L → ±5 %.
 */
export interface ChargeBalance {
  cationsMeqL: number;
  anionsMeqL: number;
  percent: number;
  /** the SM 1030 E criterion that applies, in words */
  criterion: string;
  acceptable: boolean;
}

export interface BalanceLimits {
  /** anion sum below which the absolute criterion applies, meq/L */
  lowAnionMeqL: number;
  lowAbsMeqL: number;
  midAnionMeqL: number;
  midPercent: number;
  highPercent: number;
}

export const SM1030E_LIMITS: BalanceLimits = { lowAnionMeqL: 3, lowAbsMeqL: 0.2, midAnionMeqL: 10, midPercent: 2, highPercent: 5 };

export function chargeBalance(cationsMeqL: number, anionsMeqL: number, limits: BalanceLimits = SM1030E_LIMITS): ChargeBalance {
  const sum = cationsMeqL + anionsMeqL;
  const percent = sum > 0 ? (100 * (cationsMeqL - anionsMeqL)) / sum : 0;
  let criterion: string;
  let acceptable: boolean;
  if (anionsMeqL < limits.lowAnionMeqL) {
    criterion = `anions < ${limits.lowAnionMeqL} meq/L: difference within ±${limits.lowAbsMeqL} meq/L`;
    acceptable = Math.abs(cationsMeqL - anionsMeqL) <= limits.lowAbsMeqL;
  } else if (anionsMeqL < limits.midAnionMeqL) {
    criterion = `anions ${limits.lowAnionMeqL}–${limits.midAnionMeqL} meq/L: within ±${limits.midPercent} %`;
    acceptable = Math.abs(percent) <= limits.midPercent;
  } else {
    criterion = `anions ≥ ${limits.midAnionMeqL} meq/L: within ±${limits.highPercent} %`;
    acceptable = Math.abs(percent) <= limits.highPercent;
  }
  return { cationsMeqL, anionsMeqL, percent, criterion, acceptable };
}
