// The office command: re-runs every indicator and data check on a Bankside samples CSV with the
// engine in src/chemistry, streaming (memory flat in the number of rows).
//   npm run -s recompute -- day.csv --out checked.csv
//   npm run -s recompute -- day.csv --lab lab.csv --format values --out values.csv
// Paths are relative to the folder the command was typed in. Without --out the CSV goes to
// standard output (use npm's -s so npm prints nothing of its own there).
import { createReadStream, createWriteStream, renameSync, rmSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { once } from 'node:events';
import { spawnSync } from 'node:child_process';
import { fileURLToPath, pathToFileURL } from 'node:url';

const ROOT = resolve(import.meta.dirname, '..');

// The TypeScript is bundled by Vite in a child process, so the bundler's memory (about 150 MB) is
// gone before the rows stream: this process holds only the engine, the lab index and one buffer.
if (process.env.BANKSIDE_RECOMPUTE_BUILD) {
  const { build } = await import('vite');
  await build({
    configFile: false,
    publicDir: false,
    logLevel: 'error',
    root: ROOT,
    build: { ssr: 'src/exchange/recompute.ts', outDir: process.env.BANKSIDE_RECOMPUTE_BUILD, emptyOutDir: true, target: 'node20', minify: false },
  });
  process.exit(0);
}

async function loadRecompute() {
  const outDir = join(ROOT, 'node_modules', '.cache', 'bankside-recompute', String(process.pid));
  const b = spawnSync(process.execPath, [fileURLToPath(import.meta.url)], { cwd: ROOT, env: { ...process.env, BANKSIDE_RECOMPUTE_BUILD: outDir }, stdio: ['ignore', 'ignore', 'pipe'], encoding: 'utf8' });
  try {
    if (b.status !== 0) throw new Error(`could not build the engine: ${b.stderr || b.error}`);
    return await import(pathToFileURL(join(outDir, 'recompute.js')).href);
  } finally {
    rmSync(outDir, { recursive: true, force: true });
  }
}

const USAGE = 'usage: npm run -s recompute -- samples.csv [--lab lab.csv] [--format samples|values] [--out FILE] [--encoding windows-1252]';
const FORMATS = ['samples', 'values'];

function parseArgs(argv) {
  const opts = { format: 'samples' };
  const positional = [];
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    const value = () => {
      const v = argv[++i];
      if (v === undefined || v.startsWith('--')) throw new Error(`${a} needs a value\n${USAGE}`);
      return v;
    };
    if (a === '--lab') opts.lab = value();
    else if (a === '--out') opts.out = value();
    else if (a === '--format') opts.format = value();
    else if (a === '--encoding') opts.encoding = value();
    else if (a === '--help' || a === '-h') throw new Error(USAGE);
    else if (a.startsWith('--')) throw new Error(`unknown option ${a}\n${USAGE}`);
    else positional.push(a);
  }
  if (positional.length !== 1) throw new Error(USAGE);
  if (!FORMATS.includes(opts.format)) throw new Error(`--format must be one of ${FORMATS.join(', ')} (got ${opts.format})`);
  return { ...opts, input: positional[0] };
}

const here = process.env.INIT_CWD || process.cwd();
let partial = null;
try {
  const opts = parseArgs(process.argv.slice(2));
  const rc = await loadRecompute();
  const inputPath = opts.input === '-' ? null : resolve(here, opts.input);
  const outPath = opts.out ? resolve(here, opts.out) : null;
  if (outPath && outPath === inputPath) throw new Error('--out would overwrite the input file: choose another name');
  let labIndex = new Map();
  if (opts.lab) {
    const labPath = resolve(here, opts.lab);
    let labText = '';
    for await (const t of rc.decodeText(createReadStream(labPath), opts.lab, opts.encoding)) labText += t;
    labIndex = rc.readLabIndex(labText, opts.lab);
  }
  // written beside the target and renamed at the end: a failed run never leaves a half file
  partial = outPath ? `${outPath}.partial` : null;
  const out = partial ? createWriteStream(partial) : process.stdout;
  const write = async (text) => {
    if (!out.write(text)) await once(out, 'drain');
  };
  const bytes = inputPath ? createReadStream(inputPath) : process.stdin;
  const { rows, unmatchedLab } = await rc.recomputeStream(rc.decodeText(bytes, opts.input, opts.encoding), write, labIndex, { format: opts.format });
  if (partial) {
    out.end();
    await once(out, 'finish');
    renameSync(partial, outPath);
    partial = null;
    console.error(`recompute: ${rows} samples → ${opts.out} (${opts.format})`);
  }
  if (unmatchedLab.length > 0) {
    console.error(`recompute: lab results for ${unmatchedLab.length} sample(s) not in ${opts.input} were not used: ${unmatchedLab.slice(0, 20).join(', ')}`);
  }
} catch (e) {
  if (partial) rmSync(partial, { force: true });
  console.error(`recompute: ${e instanceof Error ? e.message : String(e)}`);
  process.exitCode = 1;
}
