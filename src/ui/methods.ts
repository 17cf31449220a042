// What each number on screen is and where its method comes from: shown when a result is opened,
// and listed on the Methods and sources page.
export interface MethodNote {
  id: string;
  name: string;
  method: string;
  source: string;
}

export const METHOD_NOTES: MethodNote[] = [
  { id: 'calcite', name: 'Calcite saturation index', method: 'SI = log(a(Ca²⁺)·a(CO₃²⁻)) − log Ksp, from an ion-association speciation at the measured pH. The band is the expanded uncertainty at about 95 % (k = 2): standard uncertainties of pH (0.058, from the ±0.1 check-buffer tolerance), temperature (0.12 °C), SC (1.7 %), alkalinity (3 %), calcium (5 %), the SC→I factor (11 %), the published log K values and the activity model, replaced by the sample’s own evidence (its readings, a kit’s step) where there is some. The budget shows each source’s share.', source: 'Plummer & Busenberg (1982) GCA 46:1011; Standard Methods 2330; uncertainty by the GUM (JCGM 100:2008), coverage factor 2' },
  { id: 'minerals', name: 'Aragonite, dolomite, gypsum SI', method: 'Same speciation; dolomite needs magnesium, gypsum needs sulfate.', source: 'Plummer & Busenberg (1982); Nordstrom et al. (1990) ACS Symp. Ser. 416' },
  { id: 'ionic-strength', name: 'Ionic strength', method: 'I = ½ Σ cᵢ zᵢ² from the full analysis (after ion pairing) when the major ions are known; otherwise 1.5×10⁻⁵ × SC (µS/cm), checked against 762 real analyses (±15 %); from PSS-78 salinity for brackish water; from TDS as a last resort.', source: 'Russell (1976); Griffin & Jurinak (1973); Langelier (1936); Dickson et al. (2007)' },
  { id: 'activity', name: 'Activity model', method: 'Chosen by ionic strength: Debye–Hückel limiting law below 0.001 mol/L, extended Debye–Hückel to 0.1, Davies to 0.5, Truesdell–Jones above; A and B from the dielectric constant and density of water at the sample temperature.', source: 'Kielland (1937); Davies (1962); Truesdell & Jones (1974); Malmberg & Maryott (1956)' },
  { id: 'pco2', name: 'CO₂ partial pressure', method: 'log pCO₂ = log a(H₂CO₃*) − log K_H; the atmosphere today is about −3.38 (420 ppm). Water well above it degasses downstream and its pH and SI rise.', source: 'Plummer & Busenberg (1982)' },
  { id: 'langelier', name: 'Langelier and Ryznar indices', method: 'pHs is the pH at which this water (same calcium and alkalinity) would be saturated with calcite; LSI = pH − pHs; RSI = 2 pHs − pH.', source: 'Standard Methods 2330 B; Ryznar (1944) J. AWWA 36:472' },
  { id: 'do', name: 'Oxygen saturation', method: 'Saturation concentration at the water temperature, true barometric pressure and salinity; % = 100 × DO / saturation.', source: 'Benson & Krause (1980, 1984) as in USGS OWQ Tech. Memo 2011.03; Standard Methods 4500-O' },
  { id: 'ammonia', name: 'Un-ionized ammonia', method: 'Fraction NH₃ = 1/(10^(pKa − pH) + 1), pKa = 0.09018 + 2729.92/T.', source: 'Emerson et al. (1975) J. Fish. Res. Board Can. 32:2379' },
  { id: 'hardness', name: 'Hardness', method: 'mg/L as CaCO₃ = 2.497 Ca + 4.118 Mg (mg/L).', source: 'Standard Methods 2340 B' },
  { id: 'balance', name: 'Anion–cation balance', method: '100 (Σcations − Σanions)/(Σcations + Σanions) in meq/L; acceptance by anion sum.', source: 'Standard Methods 1030 E' },
  { id: 'sc', name: 'Specific conductance', method: 'SC₂₅ = EC / (1 + α (t − 25)), α = 0.0191 /°C unless set; calculated SC from the ions for comparison.', source: 'Standard Methods 2510' },
  { id: 'titration', name: 'Alkalinity titration', method: 'Gran function fit past the endpoint, inflection point (largest ΔpH/ΔV), or the fixed pH 4.5 endpoint with a warning; alkalinity = V·N·CF·1000/Vs.', source: 'Gran (1952) Analyst 77:661; USGS National Field Manual A6.6' },
  { id: 'stability', name: 'Stable readings', method: 'The last 5 readings each within the profile tolerance of their median (T ±0.2 °C, pH ±0.1, SC ±5 µS/cm or ±3 %, DO ±0.2 mg/L); the median is reported.', source: 'USGS National Field Manual A6.0 (criteria held in the method profile)' },
  { id: 'calibration', name: 'Meter checks', method: 'pH slope as % of Nernst (59.16 mV/pH at 25 °C) and offset at pH 7; SC check standard within ±3 % (±5 % at ≤ 100 µS/cm); DO air calibration within ±0.2 mg/L of saturation at true pressure.', source: 'USGS National Field Manual A6.2–A6.4; ASTM D1293; EPA 120.1' },
  { id: 'salinity', name: 'Practical salinity', method: 'PSS-78 from the conductivity ratio to standard seawater.', source: 'UNESCO (1983) Tech. Pap. Mar. Sci. 44' },
];

export const noteFor = (id: string) => METHOD_NOTES.find((m) => m.id === id);
