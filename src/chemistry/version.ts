/** Engine version: stored with every exported indicator so the office knows which rules computed it. */
export const ENGINE_VERSION = '1.1.0';

/** log10 of today's atmospheric CO₂ partial pressure, atm (≈ 420 ppm; common practice). */
export const ATMOSPHERIC_LOG_PCO2 = Math.log10(420e-6);
