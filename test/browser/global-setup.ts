import { build } from 'vite';

/** Build the production app once; every browser test serves this dist/. */
export default async function setup(): Promise<void> {
  process.env.NODE_ENV = 'production';
  await build({ logLevel: 'warn', configFile: 'vite.config.ts', mode: 'production' });
}
