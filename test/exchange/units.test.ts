// Lab units and censored values as labs write them. Conversion factors come from molar masses
// (IUPAC standard atomic weights, as in src/chemistry/species.ts; read) and the definitions of
// mmol, meq and "as N" / "as CaCO3" (common practice); UCUM validity from the UCUM library itself.
import { describe, expect, it } from 'vitest';
import { engineFieldOf, labEngineInputs, parseLabUnit, parseLabValue, toEngineValue } from '../../src/records/lab-units';
import { isUcum, labUnit } from '../../src/exchange/ucum';

describe('lab unit spellings → UCUM', () => {
  it.each([
    ['mg/L', 'mg/L'], ['mg/l', 'mg/L'], ['MG/L', 'mg/L'], ['µg/L', 'ug/L'], ['ug/l', 'ug/L'], ['ppm', 'mg/L'], ['ppb', 'ug/L'],
    ['meq/L', 'meq/L'], ['mmol/L', 'mmol/L'], ['umol/L', 'umol/L'],
    ['mg/l as N', 'mg{N}/L'], ['mg/L-N', 'mg{N}/L'], ['mg N/L', 'mg{N}/L'], ['mg/L (as N)', 'mg{N}/L'], ['mg{N}/L', 'mg{N}/L'],
    ['mg/L CaCO3', 'mg{CaCO3}/L'], ['mg/L as CaCO3', 'mg{CaCO3}/L'], ['mg/L as NO3', 'mg{NO3}/L'],
    ['uS/cm @25C', 'uS/cm'], ['µS/cm at 25 °C', 'uS/cm'], ['umhos/cm', 'uS/cm'], ['mS/cm', 'mS/cm'],
    ['std units', '[pH]'], ['S.U.', '[pH]'], ['pH units', '[pH]'],
    ['NTU', '{NTU}'], ['FNU', '{FNU}'], ['deg C', 'Cel'], ['%', '%'],
  ])('%s → %s, a valid UCUM code', (spelling, ucum) => {
    const u = parseLabUnit(spelling);
    expect(u?.ucum).toBe(ucum);
    expect(isUcum(ucum)).toBe(true);
  });
  it('knows the conductance basis, and refuses what it cannot read', () => {
    expect(parseLabUnit('uS/cm @25C')).toMatchObject({ kind: 'conductance', at25C: true });
    expect(parseLabUnit('uS/cm')).not.toHaveProperty('at25C');
    for (const bad of ['', 'mg/kg dry', 'units', 'furlongs', 'mg/L as Xy']) expect(parseLabUnit(bad)).toBeUndefined();
  });
  it('the office reader also takes any UCUM unit through the library (mg/dL, g/m3) and still refuses nonsense', () => {
    expect(labUnit('mg/dL')).toMatchObject({ ucum: 'mg/dL', kind: 'mass', factor: 10 });
    expect(labUnit('g/m3')).toMatchObject({ kind: 'mass', factor: 1 });
    expect(labUnit('mg/l as N')).toMatchObject({ ucum: 'mg{N}/L', basis: 'N' }); // lab spelling first
    expect(labUnit('mg/kg dry')).toBeUndefined();
    expect(labUnit('furlongs')).toBeUndefined();
  });
});

describe('lab values in the engine units', () => {
  const conv = (parameter: string, value: number, unit: string) => {
    const t = engineFieldOf(parameter)!;
    return toEngineValue(t.field, value, labUnit(unit)!, t.basis);
  };
  it('converts mmol/L, meq/L, µg/L and the "as" bases (molar masses: Ca 40.078, Mg 24.305, N 14.007, NO3 62.004, CaCO3 100.086)', () => {
    expect(conv('Calcium', 2.45, 'mmol/L')).toEqual({ value: expect.closeTo(2.45 * 40.078, 9) });
    expect(conv('Magnesium', 1.07, 'meq/L')).toEqual({ value: expect.closeTo((1.07 * 24.305) / 2, 9) });
    expect(conv('Sodium', 9800, 'ug/L')).toEqual({ value: expect.closeTo(9.8, 9) });
    expect(conv('Nitrate', 0.42, 'mg/l as N')).toEqual({ value: 0.42 });
    expect(conv('Nitrate', 4.4, 'mg/L as NO3')).toEqual({ value: expect.closeTo((4.4 * 14.007) / 62.004, 9) });
    expect(conv('Nitrate-N', 0.42, 'mg/L')).toEqual({ value: 0.42 });
    expect(conv('Calcium', 150, 'mg/L CaCO3')).toEqual({ value: expect.closeTo((150 * 40.078) / 100.086, 9) });
    expect(conv('Alkalinity, total', 3.3, 'meq/L')).toEqual({ value: expect.closeTo(3.3 * 50.043, 3) });
    expect(conv('Alkalinity', 165, 'mg/L CaCO3')).toEqual({ value: 165 });
    expect(conv('Silicon', 7, 'mg/L')).toEqual({ value: expect.closeTo((7 * 60.084) / 28.085, 9) });
  });
  it('refuses what would be a guess: nitrate without its basis, a basis that does not fit, a non-concentration', () => {
    expect(conv('Nitrate', 4.4, 'mg/L')).toEqual({ error: expect.stringMatching(/as N.*as NO3/) });
    expect(conv('Sodium', 4, 'mg/L as N')).toEqual({ error: expect.stringMatching(/does not fit/) });
    expect(conv('Sodium', 4, 'uS/cm')).toEqual({ error: expect.stringMatching(/cannot be a concentration/) });
  });
  it('labEngineInputs: detected results only, the latest of a parameter, converted', () => {
    expect(labEngineInputs([
      { parameter: 'Sodium', value: 9800, unit: 'ug/L' },
      { parameter: 'Chloride', unit: 'mg/L', censored: true },
      { parameter: 'Magnesium', value: 1, unit: 'mg/L' },
      { parameter: 'Magnesium', value: 1.07, unit: 'meq/L', unitUcum: 'meq/L' },
      { parameter: 'Turbidity', value: 1.4, unit: 'NTU' },
    ])).toEqual({ naMgL: expect.closeTo(9.8, 9), mgMgL: expect.closeTo((1.07 * 24.305) / 2, 9) });
  });
});

describe('censored values', () => {
  it.each([
    ['<0.05', '', '', { censored: true, limit: 0.05 }],
    ['< 0,05', '', '', { censored: true, limit: 0.05 }],
    ['ND', '', '0.03', { censored: true, limit: 0.03 }],
    ['n.d.', '', '', { censored: true }],
    ['not detected', '', '', { censored: true }],
    ['0.02', 'U', '', { censored: true, limit: 0.02 }],
    ['0.02', 'U', '0.01', { censored: true, limit: 0.01 }],
    ['0.05', '<', '', { censored: true, limit: 0.05 }],
    ['', 'ND', '0.1', { censored: true, limit: 0.1 }],
    ['12.1', '', '', { value: 12.1 }],
    ['0.8', 'J', '', { value: 0.8 }],
  ])('%s (qualifier %s, limit %s)', (value, q, limit, expected) => {
    expect(parseLabValue(value, q, limit)).toEqual(expected);
  });
  it('says what is wrong with anything else', () => {
    expect(parseLabValue('>2000')).toEqual({ error: expect.stringMatching(/above the lab's range/) });
    expect(parseLabValue('abc')).toEqual({ error: 'value “abc” is not a number' });
    expect(parseLabValue('')).toEqual({ error: 'no value' });
    expect(parseLabValue('ND', '', 'x')).toEqual({ error: 'detection limit “x” is not a number' });
  });
});
