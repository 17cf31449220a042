// Office check: `npm run recompute -- day.csv [--lab lab.csv] > checked.csv`
// Re-runs every indicator and data check on a Bankside samples CSV with the engine in src/chemistry.
import { readFileSync } from 'node:fs';
import { runnerImport } from 'vite';

const args = process.argv.slice(2);
const labAt = args.indexOf('--lab');
const labFile = labAt >= 0 ? args[labAt + 1] : undefined;
const input = args.find((a, i) => a !== '--lab' && (labAt < 0 || i !== labAt + 1));
if (!input) {
  console.error('usage: npm run recompute -- samples.csv [--lab lab.csv] > checked.csv');
  process.exit(2);
}
try {
  const { module } = await runnerImport('./src/exchange/recompute.ts');
  const text = readFileSync(input, 'utf8');
  const lab = labFile ? readFileSync(labFile, 'utf8') : undefined;
  process.stdout.write(module.recomputeCsv(text, lab));
} catch (e) {
  console.error(`recompute: ${e instanceof Error ? e.message : String(e)}`);
  process.exit(1);
}
