// axe-core in the page under test, for the browser tests.
import type { Page } from 'playwright-core';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);
const axeSource = readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

export interface AxeFinding {
  id: string;
  impact: string;
  nodes: number;
}

/** Every axe-core violation on the page as it is now. */
export async function axeViolations(p: Page): Promise<AxeFinding[]> {
  // evaluated through the debugging protocol: an inline <script> tag would be refused by the app's CSP
  await p.evaluate(axeSource);
  return p.evaluate(async () => {
    const r = await (window as unknown as { axe: { run(o?: unknown): Promise<{ violations: Array<{ id: string; impact: string; nodes: unknown[] }> }> } }).axe.run();
    return r.violations.map((v) => ({ id: v.id, impact: v.impact, nodes: v.nodes.length }));
  });
}

/** Only the serious and critical ones. */
export async function seriousAxe(p: Page): Promise<AxeFinding[]> {
  return (await axeViolations(p)).filter((v) => v.impact === 'serious' || v.impact === 'critical');
}
