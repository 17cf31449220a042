import type { ComponentChildren } from 'preact';
import { ATMOSPHERIC_LOG_PCO2 } from '../../chemistry';
import type { Derived } from '../../records/derive';
import { noteFor } from '../methods';
import { BandBudget } from './BandBudget';
import { SiGauge, StateBadge } from './State';
import { Icon } from './Icon';
import { splitWarnings } from '../warning-kinds';

const TITRATION_METHOD_WORDS: Record<string, string> = { gran: 'Gran function', inflection: 'inflection point', 'fixed-endpoint': 'fixed pH 4.5 endpoint', none: 'no endpoint' };

const f = (v: number | undefined, d = 2) => (v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(d));
const sign = (v: number | undefined, d = 2) => (v === undefined ? '—' : (v > 0 ? '+' : v < 0 ? '−' : '') + Math.abs(v).toFixed(d));

const SOURCE_WORDS: Record<string, string> = {
  composition: 'from the full ion analysis',
  conductance: 'estimated from specific conductance',
  salinity: 'from practical salinity',
  tds: 'estimated from TDS',
  'partial-composition': 'from the ions entered (a lower bound)',
  none: 'unknown',
};
const MODEL_WORDS: Record<string, string> = {
  'debye-huckel': 'Debye–Hückel limiting law',
  'extended-debye-huckel': 'extended Debye–Hückel',
  davies: 'Davies',
  'truesdell-jones': 'Truesdell–Jones',
};

/** One result row that opens to show its method and source. */
function Row({ label, value, note, testId, children }: { label: string; value: string; note: string; testId?: string; children?: ComponentChildren }) {
  const n = noteFor(note);
  return (
    <details class="result-row">
      <summary>
        <span class="result-label">{label}</span>
        <span class="result-value" data-testid={testId}>{value}</span>
        <Icon name="info" size={20} />
      </summary>
      <div class="result-note">
        {children}
        {n && (
          <>
            <p>{n.method}</p>
            <p class="muted">Source: {n.source}</p>
          </>
        )}
      </div>
    </details>
  );
}

export function ResultsPanel({ d }: { d: Derived }) {
  const a = d.analysis;
  if (d.error) {
    return (
      <section class="results" aria-label="Results">
        <p class="field-error" role="alert">{d.error.message}</p>
      </section>
    );
  }
  if (!a) {
    return (
      <section class="results" aria-label="Results">
        <StateBadge state="unknown" large />
        <p class="muted">Enter the water temperature, then pH, alkalinity and calcium for the calcite state.</p>
      </section>
    );
  }
  const si = a.saturationIndex;
  const w = splitWarnings(d.warnings);
  const times = a.logPco2 !== undefined ? Math.pow(10, a.logPco2 - ATMOSPHERIC_LOG_PCO2) : undefined;
  return (
    <section class="results" aria-label="Results" aria-live="polite">
      <div class="headline">
        <StateBadge state={a.calciteState} large />
        {si.calcite !== undefined && (
          <p class="big-number" data-testid="calcite-si">
            SI calcite {sign(si.calcite)} <span class="pm">± {f(a.calciteSiUncertainty)} (95 %)</span>
          </p>
        )}
        {si.calcite !== undefined && a.calciteSiUncertainty !== undefined && <SiGauge si={si.calcite} band={a.calciteSiUncertainty} />}
      </div>
      <div class="result-list">
        <Row label="Calcite SI" value={si.calcite === undefined ? 'needs pH, alkalinity, Ca' : `${sign(si.calcite)} ± ${f(a.calciteSiUncertainty)} (95 %)`} note="calcite" testId="calcite-si-row">
          {a.calciteSiBudget && a.calciteSiUncertainty !== undefined && <BandBudget band={a.calciteSiUncertainty} budget={a.calciteSiBudget} />}
        </Row>
        <Row
          label="Ionic strength"
          value={a.ionicStrength.value === undefined ? '—' : `${a.ionicStrength.value.toPrecision(3)} mol/L`}
          note="ionic-strength"
          testId="ionic-strength"
        >
          <p>{SOURCE_WORDS[a.ionicStrength.source]}{a.ionicStrength.conductanceFactor?.source === 'site' ? ` with this site's own factor (${a.ionicStrength.conductanceFactor.n} full analyses)` : ''}{a.ionicStrength.relUncertainty > 0 ? ` (±${Math.round(2 * a.ionicStrength.relUncertainty * 100)} %, 95 %)` : ''}.</p>
        </Row>
        <Row label="Activity model" value={MODEL_WORDS[a.activityModel] ?? a.activityModel} note="activity" />
        {si.aragonite !== undefined && <Row label="Aragonite SI" value={sign(si.aragonite)} note="minerals" />}
        {si.dolomite !== undefined && <Row label="Dolomite SI" value={sign(si.dolomite)} note="minerals" />}
        {si.gypsum !== undefined && <Row label="Gypsum SI" value={sign(si.gypsum)} note="minerals" />}
        {a.logPco2 !== undefined && (
          <Row label="log pCO₂" value={`${f(a.logPco2)} (${times! >= 1 ? `${times!.toFixed(times! < 10 ? 1 : 0)}× air` : `${(times! * 100).toFixed(0)} % of air`})`} note="pco2" testId="logpco2" />
        )}
        {a.langelier && <Row label="Langelier index (LSI)" value={sign(a.langelier.lsi)} note="langelier"><p>pHs = {f(a.langelier.pHs)}{a.langelier.method === 'sm-2330-formula' ? ' (Standard Methods 2330 formula: no pH below 14 saturates this water)' : ''}</p></Row>}
        {a.langelier && <Row label="Ryznar index (RSI)" value={f(a.langelier.rsi)} note="langelier" />}
        {d.doPercent !== undefined && (
          <Row label="Oxygen saturation" value={`${f(d.doPercent, 0)} %  (${f(d.doMgL, 1)} mg/L)`} note="do">
            {a.oxygen && <p>Saturation {f(a.oxygen.saturationMgL, 2)} mg/L at salinity {f(a.oxygen.salinity, 1)} and {f(a.oxygen.pressureKPa, 1)} kPa.</p>}
          </Row>
        )}
        {d.nh3 && <Row label="Un-ionized ammonia" value={`${f(d.nh3.nh3NMgL, 4)} mg/L as N (${f(d.nh3.fraction * 100, 1)} %)`} note="ammonia" />}
        {a.hardnessMgLCaCO3 !== undefined ? (
          <Row label="Hardness" value={`${f(a.hardnessMgLCaCO3, 0)} mg/L as CaCO₃`} note="hardness" />
        ) : a.calciumHardnessMgLCaCO3 !== undefined ? (
          <Row label="Calcium hardness" value={`${f(a.calciumHardnessMgLCaCO3, 0)} mg/L as CaCO₃`} note="hardness" />
        ) : null}
        {a.chargeBalance && (
          <Row label="Charge balance" value={`${sign(a.chargeBalance.percent, 1)} % ${a.chargeBalance.acceptable ? '(acceptable)' : '(fails)'}`} note="balance">
            <p>{a.chargeBalance.criterion}</p>
          </Row>
        )}
        {d.input.scUsPerCm !== undefined && d.input.scUsPerCm !== null && (
          <Row label="Specific conductance (25 °C)" value={`${f(d.input.scUsPerCm, 0)} µS/cm`} note="sc">
            {a.calculatedScUsPerCm !== undefined && <p>Calculated from the ions: {f(a.calculatedScUsPerCm, 0)} µS/cm.</p>}
          </Row>
        )}
        {d.titration && d.titration.alkalinityMgLCaCO3 !== undefined && (
          <Row label="Alkalinity (titration)" value={`${f(d.titration.alkalinityMgLCaCO3, 1)} mg/L as CaCO₃, ${TITRATION_METHOD_WORDS[d.titration.method] ?? d.titration.method}`} note="titration" />
        )}
      </div>
      {w.action.length > 0 && (
        <div class="warnings">
          <h3>Check before you leave the site</h3>
          <ul>
            {w.action.map((x, i) => (
              <li key={`${x.code}-${i}`} data-code={x.code}>
                <Icon name="warn" size={20} /> {x.message}
              </li>
            ))}
          </ul>
        </div>
      )}
      {w.notice.length > 0 && (
        <details class="notices">
          <summary>Notes on this result ({w.notice.length})</summary>
          <ul>
            {w.notice.map((x, i) => (
              <li key={`${x.code}-${i}`} data-code={x.code}>
                <Icon name="info" size={20} /> {x.message}
              </li>
            ))}
          </ul>
        </details>
      )}
    </section>
  );
}
