import { describe, expect, it } from 'vitest';
import { InputError, isExtrapolated, logK } from '../../src/chemistry';

describe('logK at 25 °C', () => {
  // Plummer & Busenberg (1982) GCA 46:1011, table of log K at 25 °C (read); the analytical
  // functions reproduce their own table to 0.001.
  it.each([
    ['co2Henry', -1.468],
    ['carbonic1', -6.352],
    ['carbonic2', -10.329],
    ['calcite', -8.48],
    ['aragonite', -8.336],
    ['CaHCO3', 1.106],
    ['CaCO3aq', 3.224],
  ] as const)('%s = %d (Plummer & Busenberg 1982)', (reaction, expected) => {
    expect(Math.abs(logK(reaction, 25) - expected)).toBeLessThan(0.0015);
  });
  it('dolomite −17.09 and gypsum −4.58 (Nordstrom et al. 1990, ACS Symp. Ser. 416; from memory)', () => {
    expect(logK('dolomite', 25)).toBeCloseTo(-17.09, 6);
    expect(logK('gypsum', 25)).toBeCloseTo(-4.58, 6);
  });
});

describe('logK over temperature', () => {
  it('water: pKw 14.946 at 0 °C, 13.995 at 25 °C, 13.264 at 50 °C (Bandura & Lvov 2006 via CRC Handbook; read)', () => {
    // The Standard Methods 2330 fit reproduces these to within 0.01.
    expect(Math.abs(-logK('water', 0) - 14.946)).toBeLessThan(0.01);
    expect(Math.abs(-logK('water', 25) - 13.995)).toBeLessThan(0.01);
    expect(Math.abs(-logK('water', 50) - 13.264)).toBeLessThan(0.01);
  });
  it('calcite is less soluble in warm water (retrograde solubility; Plummer & Busenberg 1982)', () => {
    expect(logK('calcite', 5)).toBeGreaterThan(logK('calcite', 25));
    expect(logK('calcite', 25)).toBeGreaterThan(logK('calcite', 50));
    // their table: −8.38 at 0 °C and −8.66 at 50 °C, within 0.02 (from memory)
    expect(Math.abs(logK('calcite', 0) - -8.38)).toBeLessThan(0.02);
    expect(Math.abs(logK('calcite', 50) - -8.66)).toBeLessThan(0.02);
  });
  it('carbonic acid: pK1 6.58 at 0 °C and 6.29 at 50 °C; pK2 10.63 at 0 °C (Plummer & Busenberg 1982; from memory)', () => {
    expect(Math.abs(-logK('carbonic1', 0) - 6.58)).toBeLessThan(0.01);
    expect(Math.abs(-logK('carbonic1', 50) - 6.29)).toBeLessThan(0.015);
    expect(Math.abs(-logK('carbonic2', 0) - 10.63)).toBeLessThan(0.01);
  });
  it('flags extrapolation outside each function’s published range', () => {
    expect(isExtrapolated('calcite', 60)).toBe(false);
    expect(isExtrapolated('calcite', 95)).toBe(true);
    expect(isExtrapolated('dolomite', 60)).toBe(true);
  });
  it('refuses unknown reactions and impossible temperatures', () => {
    // @ts-expect-error not a reaction
    expect(() => logK('halite', 25)).toThrow(InputError);
    expect(() => logK('calcite', 150)).toThrow(/tempC/);
    expect(() => logK('calcite', Number.NaN)).toThrow(InputError);
  });
});
