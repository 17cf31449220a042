import { describe, expect, it } from 'vitest';
import {
  analyzeSample,
  InputError,
  ionicStrengthFromSalinity,
  oxygenMgLFromPercent,
  oxygenPercentSaturation,
  oxygenSaturationMgL,
  practicalSalinity,
  pressureToKPa,
  salinityFromConductivity,
  specificConductance,
  stationPressureKPa,
  unionizedAmmonia,
  unionizedAmmoniaFraction,
} from '../../src/chemistry';

describe('specificConductance (Standard Methods 2510, linear compensation)', () => {
  it('is the identity at 25 °C and follows EC/(1 + α(t − 25))', () => {
    expect(specificConductance(500, 25)).toBe(500);
    expect(specificConductance(400, 15, 0.0191)).toBeCloseTo(400 / (1 - 0.191), 9);
  });
  it('0.01 mol/L KCl reads 1278 µS/cm at 20 °C and 1413 at 25 °C (OIML R 56 / ASTM D1125; from memory): α = 0.0191 maps one to the other within 0.5 %', () => {
    expect(Math.abs(specificConductance(1278, 20) / 1413 - 1)).toBeLessThan(0.005);
  });
  it('refuses impossible input with the field named', () => {
    expect(() => specificConductance(-1, 10)).toThrow(InputError);
    expect(() => specificConductance(100, 10, 0.2)).toThrow(/alpha/);
  });
});

describe('oxygen saturation (Benson & Krause, USGS OWQ memo 2011.03 / Standard Methods 4500-O)', () => {
  it('14.621 mg/L at 0 °C, 1 atm, fresh (read); 9.092 at 20 °C and 8.263 at 25 °C (from memory)', () => {
    expect(oxygenSaturationMgL(0)).toBeCloseTo(14.621, 3);
    expect(oxygenSaturationMgL(20)).toBeCloseTo(9.092, 2);
    expect(oxygenSaturationMgL(25)).toBeCloseTo(8.263, 2);
  });
  it('scales nearly with pressure: at 0.8 atm, 25 °C about 0.8 × 8.26 (USGS memo 2011.03 pressure correction)', () => {
    const r = oxygenSaturationMgL(25, 0.8 * 101.325) / oxygenSaturationMgL(25);
    expect(r).toBeGreaterThan(0.79);
    expect(r).toBeLessThan(0.8);
  });
  it('falls with salinity: seawater S = 35 at 25 °C holds about 6.7 mg/L (Benson & Krause 1984; from memory)', () => {
    expect(Math.abs(oxygenSaturationMgL(25, 101.325, 35) - 6.73)).toBeLessThan(0.05);
  });
  it('percent saturation and its inverse agree', () => {
    expect(oxygenPercentSaturation(9.092, 20)).toBeCloseTo(100, 1);
    expect(oxygenMgLFromPercent(50, 0)).toBeCloseTo(14.621 / 2, 3);
  });
  it('refuses temperatures and pressures outside the published range', () => {
    expect(() => oxygenSaturationMgL(45)).toThrow(InputError);
    expect(() => oxygenSaturationMgL(10, 30)).toThrow(/pressureKPa/);
  });
});

describe('pressure', () => {
  it('converts units exactly: 760 mmHg = 1013.25 hPa = 101.325 kPa (definitions)', () => {
    expect(pressureToKPa(760, 'mmHg')).toBeCloseTo(101.325, 4);
    expect(pressureToKPa(1013.25, 'hPa')).toBeCloseTo(101.325, 9);
  });
  it('station pressure at 1,000 m is about 89.9 kPa in the standard atmosphere (ICAO; from memory) and matches the −2.5 mmHg/100 ft rule within 1 % (common practice)', () => {
    const p = stationPressureKPa(101.325, 1000);
    expect(Math.abs(p - 89.87)).toBeLessThan(0.1);
    const rule = pressureToKPa(760 - 2.5 * (1000 / 30.48), 'mmHg');
    expect(Math.abs(p / rule - 1)).toBeLessThan(0.01);
  });
});

describe('unionizedAmmoniaFraction (Emerson et al. 1975)', () => {
  it('≈ 5.38 % at 25 °C and pH 8.0 (from memory)', () => {
    expect(unionizedAmmoniaFraction(8, 25) * 100).toBeCloseTo(5.38, 1);
  });
  it('rises with pH and temperature; pKa at 25 °C = 9.246 (the formula itself)', () => {
    expect(unionizedAmmoniaFraction(9.246, 25)).toBeCloseTo(0.5, 2);
    expect(unionizedAmmoniaFraction(8, 10)).toBeLessThan(unionizedAmmoniaFraction(8, 25));
    const r = unionizedAmmonia(1, 8, 25);
    expect(r.nh3MgL).toBeCloseTo((r.nh3NMgL * 17.031) / 14.007, 12);
  });
});

describe('practicalSalinity (PSS-78, UNESCO 1983 Tech. Pap. Mar. Sci. 44)', () => {
  it('R = 1 at 15 °C is exactly S = 35 (definition)', () => {
    expect(practicalSalinity(1, 15 / 1.00024)).toBeCloseTo(35, 3);
  });
  it('check value: R = 1.888091, t68 = 40 °C, p = 10000 dbar → S = 40.0000 (read)', () => {
    expect(practicalSalinity(1.888091, 40 / 1.00024, 10000)).toBeCloseTo(40, 4);
  });
  it('a brackish sample: C = 42.914 mS/cm at 15 °C is S = 35; half the conductivity gives a little under half the salinity (PSS-78 is nonlinear in R)', () => {
    expect(salinityFromConductivity(42914, 15 / 1.00024).salinity).toBeCloseTo(35, 3);
    const half = salinityFromConductivity(42914 / 2, 15 / 1.00024);
    expect(half.salinity).toBeGreaterThan(15.5);
    expect(half.salinity).toBeLessThan(17.5);
    expect(half.inRange).toBe(true);
    expect(salinityFromConductivity(500, 15).inRange).toBe(false);
  });
  it('ionic strength of seawater S = 35 is 0.7227 mol/kg (DOE 1994 / Dickson et al. 2007; from memory)', () => {
    expect(Math.abs(ionicStrengthFromSalinity(35) - 0.7227)).toBeLessThan(1e-4);
  });
  it('analyzeSample leans on salinity from SC for brackish water without an analysis', () => {
    const a = analyzeSample({ tempC: 18, pH: 7.9, scUsPerCm: 25000, alkalinityMgLCaCO3: 110, caMgL: 200 });
    expect(a.ionicStrength.source).toBe('conductance');
    expect(a.ionicStrength.seawaterWeight!).toBeGreaterThan(0.9);
    expect(a.ionicStrength.value!).toBeGreaterThan(0.25);
    expect(a.ionicStrength.value!).toBeLessThan(0.4);
    expect(a.activityModel).toBe('truesdell-jones');
    expect(a.warnings.map((w) => w.code)).toContain('seawater-ions-implied');
  });
});
