// Memory and speed of the office command on a large day file: `n` samples-CSV rows (the demo
// day's rows repeated with new IDs) are piped into `recompute.mjs -`, its CSV read and counted
// from standard output, and its peak resident memory (maxRSS) reported by the process itself.
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { once } from 'node:events';
import { performance } from 'node:perf_hooks';

const REPORT = 'data:text/javascript,process.on("exit",()=>process.stderr.write("maxrss_kb="+process.resourceUsage().maxRSS+"\\n"))';

export async function recomputeBench(n) {
  const [header, ...rows] = readFileSync('test/fixtures/exchange/demo-day.csv', 'utf8').trim().split('\r\n');
  const child = spawn(process.execPath, ['--import', REPORT, 'scripts/recompute.mjs', '-'], { stdio: ['pipe', 'pipe', 'pipe'] });
  let outBytes = 0;
  let outRows = 0;
  child.stdout.on('data', (b) => {
    outBytes += b.length;
    for (const c of b) if (c === 0x0a) outRows++;
  });
  let err = '';
  child.stderr.on('data', (b) => (err += b));
  const t0 = performance.now();
  const feed = async () => {
    let buf = header + '\r\n';
    for (let i = 0; i < n; i++) {
      const r = rows[i % rows.length];
      buf += r.replace(/^demo-sample-[^,]+/, `bench-${i}`) + '\r\n';
      if (buf.length > 256_000) {
        if (!child.stdin.write(buf)) await once(child.stdin, 'drain');
        buf = '';
      }
    }
    child.stdin.end(buf);
  };
  await Promise.all([feed(), once(child, 'exit')]);
  const seconds = (performance.now() - t0) / 1000;
  const rss = /maxrss_kb=(\d+)/.exec(err);
  if (child.exitCode !== 0 || !rss) throw new Error(`recompute failed: ${err.slice(0, 500)}`);
  return { rows: outRows - 1, seconds, maxRssMb: Number(rss[1]) / 1024, outMb: outBytes / 1e6 };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const n = Number(process.argv[2] ?? 100_000);
  console.log(await recomputeBench(n));
}
