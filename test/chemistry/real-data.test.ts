// Checks the engine against 1,201 real analyses (USGS INL, public domain) and 153 from Kwale,
// Kenya (CC BY 4.0); see test/fixtures/real/PROVENANCE.md. Results are stated as distributions:
// real data carry real analytical error, so the assertions bound quantiles, not single values.
import { describe, expect, it } from 'vitest';
import { analyzeSample, DEFAULT_CONDUCTANCE_FACTOR, MG_CACO3_PER_MEQ, specificConductance, SPECIES } from '../../src/chemistry';
import { inlSamples, kwaleSamples, quantile } from '../fixtures/real/load';

const inl = inlSamples();
const complete = inl.filter((s) => s.sc !== undefined && s.sc > 10 && s.pH !== undefined && s.anc !== undefined);
const analysed = complete.map((s) => ({
  s,
  a: analyzeSample({
    tempC: s.tempC ?? 15,
    pH: s.pH,
    scUsPerCm: s.sc,
    alkalinityMgLCaCO3: s.anc,
    caMgL: s.ca, mgMgL: s.mg, naMgL: s.na, kMgL: s.k, clMgL: s.cl, so4MgL: s.so4,
    fMgL: s.f, no3NMgL: s.no3N, sio2MgL: s.sio2,
  }),
}));

describe('USGS INL analyses (1,201 samples; 762 with SC, pH, ANC and all major ions)', () => {
  it('loads the fixture as published', () => {
    expect(inl).toHaveLength(1201);
    expect(analysed.length).toBeGreaterThan(750);
  });

  it('charge balance: ≥ 90 % within ±5 % (the data provider found 699 of 764 with ANC as HCO3)', () => {
    const cb = analysed.map(({ a }) => a.chargeBalancePercent!);
    const within5 = cb.filter((x) => Math.abs(x) <= 5).length / cb.length;
    expect(within5).toBeGreaterThan(0.9);
    expect(Math.abs(quantile(cb, 0.5))).toBeLessThan(2);
  });

  it('calculated vs measured SC (Debye–Hückel–Onsager; SM 1030 E accepts 0.9–1.1): median 0.98–1.02, ≥ 90 % within 0.9–1.1 (the old SM 2510 y² method: 0.97, 89 %)', () => {
    const r = analysed.map(({ a, s }) => a.calculatedScUsPerCm! / s.sc!);
    expect(quantile(r, 0.5)).toBeGreaterThan(0.98);
    expect(quantile(r, 0.5)).toBeLessThan(1.02);
    expect(r.filter((x) => x >= 0.9 && x <= 1.1).length / r.length).toBeGreaterThan(0.9);
  });

  it('SC-based ionic strength against the full analysis: default factor within the central range, ±15 % holds for ~90 %', () => {
    const ratio = analysed.map(({ a, s }) => a.ionicStrength.value! / s.sc!);
    const median = quantile(ratio, 0.5);
    // Published factors 1.27e-5 (Griffin & Jurinak 1973) to 1.6e-5 (Russell 1976): the data sit between.
    expect(median).toBeGreaterThan(1.27e-5);
    expect(median).toBeLessThan(1.6e-5);
    expect(Math.abs(DEFAULT_CONDUCTANCE_FACTOR / median - 1)).toBeLessThan(0.03);
    const rel = ratio.map((x) => x / DEFAULT_CONDUCTANCE_FACTOR - 1);
    expect(rel.filter((x) => Math.abs(x) <= 0.15).length / rel.length).toBeGreaterThan(0.85);
    expect(quantile(rel, 0.05)).toBeGreaterThan(-0.25);
    expect(quantile(rel, 0.95)).toBeLessThan(0.15);
  });

  it('SI values are physically sensible: calcite SI within −3…+2 for ≥ 98 % and always finite', () => {
    const si = analysed.map(({ a }) => a.saturationIndex.calcite);
    expect(si.every((x) => x !== undefined && Number.isFinite(x))).toBe(true);
    expect(si.filter((x) => x! > -3 && x! < 2).length / si.length).toBeGreaterThan(0.98);
    expect(analysed.every(({ a }) => a.speciation!.converged)).toBe(true);
  });

  it('catches the known unit slip: well NRF 6, 2023-05-23, SC 1.88 with Cl 376 mg/L (PROVENANCE.md)', () => {
    const bad = inl.find((s) => s.site.startsWith('NRF 6') && s.datetime.startsWith('2023-05-23'));
    expect(bad?.sc).toBe(1.88);
    const a = analyzeSample({
      tempC: bad!.tempC ?? 15, pH: bad!.pH, scUsPerCm: bad!.sc, alkalinityMgLCaCO3: bad!.anc,
      caMgL: bad!.ca, mgMgL: bad!.mg, naMgL: bad!.na, kMgL: bad!.k, clMgL: bad!.cl, so4MgL: bad!.so4,
    });
    expect(a.warnings.map((w) => w.code)).toContain('possible-unit-slip');
    // … and no false alarm on the good analyses: fewer than 1 % raise it.
    const alarms = analysed.filter(({ a }) => a.warnings.some((w) => w.code === 'possible-unit-slip')).length;
    expect(alarms / analysed.length).toBeLessThan(0.01);
  });
});

describe('Kwale groundwater (153 samples, fresh to saline, 23–59 °C)', () => {
  const kw = kwaleSamples().filter((s) => s.cl !== undefined && s.so4 !== undefined);
  const hco3ToCaCO3 = MG_CACO3_PER_MEQ / SPECIES.HCO3.molarMass;
  const res = kw.map((s) => ({
    s,
    a: analyzeSample({
      tempC: s.tempC, pH: s.pH, scUsPerCm: s.ecUsPerCm, alkalinityMgLCaCO3: s.alkHco3MgL * hco3ToCaCO3,
      caMgL: s.ca, mgMgL: s.mg, naMgL: s.na, kMgL: s.k, clMgL: s.cl, so4MgL: s.so4,
    }),
  }));
  it('every sample speciates to convergence with finite indices, brackish and hot ones included', () => {
    expect(res.length).toBeGreaterThan(145);
    for (const { a } of res) {
      expect(a.speciation!.converged).toBe(true);
      expect(Number.isFinite(a.saturationIndex.calcite!)).toBe(true);
    }
    expect(Math.max(...res.map(({ s }) => s.tempC))).toBeGreaterThan(55);
  });
  it('calculated SC of Na–Cl and fresh waters: the conductance cross-check no longer cries wolf (issue 12: 58 of 153 flagged before)', () => {
    // "Cond." is not stated as SC at 25 °C (PROVENANCE.md): read as given, and as EC at the sample's
    // temperature compensated with α = 0.0191 (Standard Methods 2510; from memory). The second fits better.
    const run = (compensate: boolean) =>
      kw.map((s) => {
        const sc = compensate ? specificConductance(s.ecUsPerCm, s.tempC) : s.ecUsPerCm;
        const a = analyzeSample({
          tempC: s.tempC, pH: s.pH, scUsPerCm: sc, alkalinityMgLCaCO3: s.alkHco3MgL * hco3ToCaCO3,
          caMgL: s.ca, mgMgL: s.mg, naMgL: s.na, kMgL: s.k, clMgL: s.cl, so4MgL: s.so4,
          no3NMgL: s.no3 !== undefined ? (s.no3 * 14.007) / 62.004 : undefined, fMgL: s.f,
        });
        const naCl = s.na / 22.99 > 0.5 * (s.na / 22.99 + (2 * s.ca) / 40.078 + (2 * s.mg) / 24.305);
        return { ratio: a.calculatedScUsPerCm! / sc, naCl, flagged: a.warnings.some((w) => w.code === 'sc-ion-mismatch' || w.code === 'possible-unit-slip') };
      });
    const asGiven = run(false), compensated = run(true);
    expect(asGiven.filter((x) => x.flagged).length).toBeLessThan(35);
    expect(compensated.filter((x) => x.flagged).length).toBeLessThan(25);
    const med = quantile(compensated.map((x) => x.ratio), 0.5);
    expect(med).toBeGreaterThan(0.93);
    expect(med).toBeLessThan(1.03);
    const nacl = compensated.filter((x) => x.naCl);
    expect(nacl.length).toBeGreaterThan(40);
    expect(Math.abs(quantile(nacl.map((x) => x.ratio), 0.5) - 1)).toBeLessThan(0.05);
  });
  it('Na–Cl waters conduct more per unit ionic strength: median I/EC below the Ca–HCO3 default (1.0–1.4e-5)', () => {
    const r = res.map(({ a, s }) => a.ionicStrength.value! / s.ecUsPerCm);
    expect(quantile(r, 0.5)).toBeGreaterThan(1.0e-5);
    expect(quantile(r, 0.5)).toBeLessThan(1.4e-5);
  });
});
