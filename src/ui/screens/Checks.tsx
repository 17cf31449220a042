import { useMemo, useState } from 'preact/hooks';
import { conductivityStandardCheck, doAirCalibrationCheck, InputError, phCalibration, pressureToKPa } from '../../chemistry';
import type { CalibrationEvent } from '../../records/schema';
import { isoWithOffset, todayLocal } from '../../records/time';
import { listCalibrationsForDay, listInstruments, saveCalibration, saveInstrument, toStoreError, type CalibrationInput } from '../../store/records';
import { Choice, SelectField, TextField } from '../components/Field';
import type { MethodProfile } from '../../chemistry';
import { useLive, useProfile, useSettings } from '../data';
import { showTime } from '../format';

const CHECK_WORDS: Record<string, string> = { pH: 'pH check', sc: 'SC check', do: 'DO check' };
import { parseDecimal } from '../forms/parse';

type Param = 'pH' | 'sc' | 'do';

const num = (raw: string) => {
  const p = parseDecimal(raw, { label: 'value' });
  return p.ok ? p.value : undefined;
};

function describe(c: CalibrationEvent, profile: MethodProfile): string {
  const e = c.entries;
  if (e.parameter === 'pH') {
    const r = phCalibration(e.buffers, profile);
    return r.slopePercent !== undefined ? `slope ${r.slopePercent.toFixed(1)} %, offset ${r.offsetMv!.toFixed(1)} mV` : `offset ${r.offsetMv?.toFixed(1)} mV (one buffer)`;
  }
  if (e.parameter === 'sc') return `standard ${e.standardUsPerCm} µS/cm, read ${e.readingUsPerCm} (${((100 * (e.readingUsPerCm - e.standardUsPerCm)) / e.standardUsPerCm).toFixed(1)} %)`;
  if (e.parameter === 'do') return `read ${e.readingMgL} mg/L at ${e.tempC} °C, ${e.pressureKPa} kPa`;
  return `reference ${e.referenceC} °C, read ${e.readingC} °C`;
}

export function ChecksScreen() {
  const settings = useSettings();
  const profile = useProfile();
  const today = todayLocal();
  const instruments = useLive(listInstruments, [], ['instruments']);
  const events = useLive(() => listCalibrationsForDay(today), [today], ['calibrations']);
  const [instrumentId, setInstrumentId] = useState('');
  const [param, setParam] = useState<Param>('pH');
  const [buffers, setBuffers] = useState([{ pH: '7.00', mV: '', t: '' }, { pH: '4.00', mV: '', t: '' }, { pH: '10.01', mV: '', t: '' }]);
  const [scStd, setScStd] = useState('1413');
  const [scRead, setScRead] = useState('');
  const [doRead, setDoRead] = useState('');
  const [doTemp, setDoTemp] = useState('');
  const [pressure, setPressure] = useState('');
  const [pressureUnit, setPressureUnit] = useState<'hPa' | 'kPa' | 'mmHg'>('hPa');
  const [newName, setNewName] = useState('');
  const [msg, setMsg] = useState('');
  const [err, setErr] = useState('');

  const instrumentList = instruments.data ?? [];
  const selected = instrumentId || instrumentList[0]?.id || '';

  const verdict = useMemo(() => {
    try {
      if (param === 'pH') {
        const b = buffers
          .map((x) => ({ bufferPH: num(x.pH), mV: num(x.mV), tempC: num(x.t) }))
          .filter((x): x is { bufferPH: number; mV: number; tempC: number } => x.bufferPH !== undefined && x.mV !== undefined && x.tempC !== undefined);
        if (b.length === 0) return null;
        const r = phCalibration(b, profile);
        return { pass: r.pass, text: r.slopePercent !== undefined ? `Slope ${r.slopePercent.toFixed(1)} % of Nernst, offset ${r.offsetMv!.toFixed(1)} mV at pH 7` : `Offset ${r.offsetMv?.toFixed(1)} mV (slope needs a second buffer)`, warnings: r.warnings.map((w) => w.message), entries: { parameter: 'pH' as const, buffers: b } };
      }
      if (param === 'sc') {
        const s = num(scStd), r = num(scRead);
        if (s === undefined || r === undefined) return null;
        const c = conductivityStandardCheck(s, r, profile);
        return { pass: c.pass, text: `${c.deviationPercent >= 0 ? '+' : ''}${c.deviationPercent.toFixed(1)} % from the standard (limit ±${c.limitPercent} %)`, warnings: c.pass ? [] : ['Outside the limit: clean the cell, check the standard’s expiry, recalibrate.'], entries: { parameter: 'sc' as const, standardUsPerCm: s, readingUsPerCm: r } };
      }
      const rd = num(doRead), t = num(doTemp), p = num(pressure);
      if (rd === undefined || t === undefined || p === undefined) return null;
      const kPa = pressureToKPa(p, pressureUnit);
      const c = doAirCalibrationCheck(rd, t, kPa, 0, profile);
      return { pass: c.pass, text: `Theoretical ${c.theoreticalMgL.toFixed(2)} mg/L; reading ${c.differenceMgL >= 0 ? '+' : ''}${c.differenceMgL.toFixed(2)} mg/L (limit ±${profile.doCalibration.absMgL})`, warnings: c.pass ? [] : ['Outside the limit: check the membrane or cap, use true (station) pressure, recalibrate.'], entries: { parameter: 'do' as const, readingMgL: rd, tempC: t, pressureKPa: kPa, salinity: 0 } };
    } catch (e) {
      return { pass: false, text: e instanceof InputError ? e.message : String(e), warnings: [], entries: null };
    }
  }, [param, buffers, scStd, scRead, doRead, doTemp, pressure, pressureUnit, profile]);

  const save = async () => {
    setErr('');
    if (!selected) return setErr('Add the meter first.');
    if (!verdict?.entries) return setErr('Enter the readings first.');
    const input: CalibrationInput = {
      instrumentId: selected, parameter: param, time: isoWithOffset(), operator: settings.operator, kind: 'calibration',
      entries: verdict.entries, pass: verdict.pass, profileId: profile.id, profileVersion: profile.version,
    };
    try {
      await saveCalibration(input, settings.operator || 'field crew');
      setMsg(`Saved: ${CHECK_WORDS[param]} ${verdict.pass ? 'passed' : 'failed: recalibrate before sampling'}.`);
    } catch (e) {
      setErr(toStoreError(e).message);
    }
  };

  return (
    <section>
      <p class="lead">Check each meter before and after sampling. Samples without a passing check within {profile.calibrationWindowHours} h are marked on the day list.</p>
      <p class="muted">Method profile: {profile.name}, version {profile.version}.</p>
      {instrumentList.length > 0 ? (
        <SelectField id="instrument" label="Meter" value={selected} onChange={setInstrumentId}>
          {instrumentList.map((i) => <option key={i.id} value={i.id}>{i.name}{i.serial ? ` (${i.serial})` : ''}</option>)}
        </SelectField>
      ) : <p class="muted">No meters yet: add one.</p>}
      <div class="row2">
        <TextField id="newMeter" label="Add a meter (name or serial)" value={newName} onInput={setNewName} />
        <button type="button" class="btn btn-small" onClick={async () => {
          if (!newName.trim()) return;
          const i = await saveInstrument({ name: newName.trim(), sensors: ['temperature', 'pH', 'sc', 'do'] }, settings.operator || 'field crew');
          setInstrumentId(i.id); setNewName('');
        }}>Add meter</button>
      </div>
      <Choice name="param" label="Check" value={param} onChange={setParam} options={[{ value: 'pH', label: 'pH buffers' }, { value: 'sc', label: 'SC standard' }, { value: 'do', label: 'DO in air' }]} />
      {param === 'pH' && (
        <div>
          <p class="hint">First two buffers calibrate; a third is read back as a check. Enter each buffer's pH at its temperature.</p>
          {buffers.map((b, i) => (
            <div class="row3" key={i}>
              <TextField id={`buf-${i}`} label={`Buffer ${i + 1} pH`} numeric value={b.pH} onInput={(v) => setBuffers(buffers.map((x, k) => (k === i ? { ...x, pH: v } : x)))} />
              <TextField id={`mv-${i}`} label={`Buffer ${i + 1} reading`} unit="mV" numeric value={b.mV} onInput={(v) => setBuffers(buffers.map((x, k) => (k === i ? { ...x, mV: v } : x)))} />
              <TextField id={`bt-${i}`} label={`Buffer ${i + 1} temperature`} unit="°C" numeric value={b.t} onInput={(v) => setBuffers(buffers.map((x, k) => (k === i ? { ...x, t: v } : x)))} />
            </div>
          ))}
        </div>
      )}
      {param === 'sc' && (
        <div class="row2">
          <TextField id="scStd" label="Standard value at 25 °C" unit="µS/cm" numeric value={scStd} onInput={setScStd} />
          <TextField id="scRead" label="Meter reading (SC at 25 °C)" unit="µS/cm" numeric value={scRead} onInput={setScRead} />
        </div>
      )}
      {param === 'do' && (
        <div>
          <div class="row2">
            <TextField id="doRead" label="DO reading in air" unit="mg/L" numeric value={doRead} onInput={setDoRead} />
            <TextField id="doTemp" label="Temperature" unit="°C" numeric value={doTemp} onInput={setDoTemp} />
          </div>
          <div class="row2">
            <TextField id="doP" label="True barometric pressure" unit={pressureUnit} numeric value={pressure} onInput={setPressure} hint="Station pressure, not the sea-level value a forecast gives (about −2.5 mmHg per 100 ft)." />
            <SelectField id="doPU" label="Pressure unit" value={pressureUnit} onChange={(v) => setPressureUnit(v as 'hPa' | 'kPa' | 'mmHg')}>
              <option value="hPa">hPa</option><option value="kPa">kPa</option><option value="mmHg">mmHg</option>
            </SelectField>
          </div>
        </div>
      )}
      {verdict && (
        <div class={verdict.pass ? 'verdict pass' : 'verdict fail'} role="status" data-testid="check-verdict">
          <strong>{verdict.pass ? '✓ Pass' : '✗ Fail'}</strong> · {verdict.text}
          {verdict.warnings.length > 0 && <ul>{verdict.warnings.map((w, i) => <li key={i}>{w}</li>)}</ul>}
        </div>
      )}
      {err && <p class="field-error" role="alert">{err}</p>}
      {msg && <p class="notice" role="status">{msg}</p>}
      <button type="button" class="btn btn-primary btn-block" onClick={save}>Save check</button>
      <h2>Today's checks</h2>
      {(events.data ?? []).length === 0 ? <p class="muted">None yet today.</p> : (
        <ul class="cards">
          {(events.data ?? []).map((c) => (
            <li key={c.id} class="card">
              <span class="card-title">{showTime(c.time)} · {CHECK_WORDS[c.parameter] ?? c.parameter} · {c.pass ? '✓ pass' : '✗ fail'}</span>
              <span class="muted">{describe(c, profile)} · {instrumentList.find((i) => i.id === c.instrumentId)?.name ?? c.instrumentId} · profile {c.profileId} v{c.profileVersion}</span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
