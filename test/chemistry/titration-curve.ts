// Synthetic acid titrations computed from the carbonate equilibria (Plummer & Busenberg 1982
// constants via the engine's logK; ideal activities), for testing endpoint detection against a
// known answer. Not the code under test: an independent charge-balance solve by bisection.
import { logK } from '../../src/chemistry';

export interface CurveSpec {
  sampleMl: number;
  alkMeqL: number;
  initialPH: number;
  normality: number;
  volumesMl: number[];
  tempC?: number;
  /** pH noise half-width, uniform, from a seeded generator */
  noise?: number;
  seed?: number;
}

/** mulberry32: a small seeded generator, so synthetic data and Monte Carlo tests are repeatable. */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function titrationCurve(spec: CurveSpec): Array<{ titrantMl: number; pH: number }> {
  const t = spec.tempC ?? 25;
  const K1 = 10 ** logK('carbonic1', t), K2 = 10 ** logK('carbonic2', t), Kw = 10 ** logK('water', t);
  const alpha = (h: number) => {
    const d = h * h + K1 * h + K1 * K2;
    return (K1 * h + 2 * K1 * K2) / d;
  };
  const A = spec.alkMeqL / 1000;
  const h0 = 10 ** -spec.initialPH;
  const CT = (A - Kw / h0 + h0) / alpha(h0);
  const rnd = mulberry32(spec.seed ?? 1);
  return spec.volumesMl.map((v) => {
    const dil = spec.sampleMl / (spec.sampleMl + v);
    const alkNow = (A * spec.sampleMl - (spec.normality * v)) / (spec.sampleMl + v);
    const f = (logH: number) => {
      const h = 10 ** logH;
      return CT * dil * alpha(h) + Kw / h - h - alkNow;
    };
    let lo = -14, hi = 0; // f decreasing in h
    for (let i = 0; i < 200; i++) {
      const mid = (lo + hi) / 2;
      if (f(mid) > 0) lo = mid; else hi = mid;
    }
    const pH = -(lo + hi) / 2 + (spec.noise ? (rnd() * 2 - 1) * spec.noise : 0);
    return { titrantMl: v, pH: Math.round(pH * 1000) / 1000 };
  });
}

export function range(from: number, to: number, step: number): number[] {
  const out: number[] = [];
  for (let v = from; v <= to + 1e-9; v += step) out.push(Math.round(v * 10000) / 10000);
  return out;
}
