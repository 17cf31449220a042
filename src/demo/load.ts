// Load or remove the invented demo scenario through the normal store (so it is backed up,
// exported and validated like real records, and marked demo: true).
import { removeDemo, saveCalibration, saveInstrument, saveSample, saveSite } from '../store/records';
import { DEMO_BY, DEMO_INSTRUMENTS, DEMO_SITES, demoRecords } from './scenario';

export async function loadDemo(today = new Date()): Promise<{ sites: number; samples: number; checks: number }> {
  for (const s of DEMO_SITES) await saveSite(s, DEMO_BY);
  for (const i of DEMO_INSTRUMENTS) await saveInstrument(i, DEMO_BY);
  const { samples, calibrations } = demoRecords(today);
  for (const c of calibrations) await saveCalibration(c, DEMO_BY);
  for (const s of samples) await saveSample(s, DEMO_BY);
  return { sites: DEMO_SITES.length, samples: samples.length, checks: calibrations.length };
}

export { removeDemo };
