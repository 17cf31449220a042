// `npm start`: build the production app (with its service worker) and serve it on
// localhost. The invented demo scenario is loaded from inside the app.
import { build, preview } from 'vite';

const port = Number(process.env.PORT ?? 4173);
await build({ logLevel: 'warn' });
const server = await preview({ preview: { port, strictPort: true, host: '127.0.0.1', open: false } });
const url = server.resolvedUrls?.local[0] ?? `http://127.0.0.1:${port}/`;
console.log(`\nBankside is running at ${url}`);
console.log('Open it in Chromium or Chrome; load the demo creek from the Today screen. Ctrl+C stops the server.');
