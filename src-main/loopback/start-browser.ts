// Entry point of the browser host (`npm start` where the Electron runtime is missing): serves the
// built renderer and the same handlers on 127.0.0.1 and prints the address with its token.
import { randomUUID } from 'node:crypto';
import path from 'node:path';
import { APP_NAME, APP_VERSION } from '../app-meta';
import { browserHostFolders } from '../host-paths';
import { chromiumPrinter } from '../report/chromium-pdf';
import { startLoopbackHost } from './server';

const here = import.meta.dirname;
const appRoot = path.resolve(here, '..', '..');
const portArgument = process.argv.indexOf('--port');
const port = portArgument > 0 ? Number(process.argv[portArgument + 1]) : 0;

const host = await startLoopbackHost({
  rendererDir: path.join(appRoot, 'out', 'renderer'),
  port: Number.isInteger(port) && port >= 0 && port < 65536 ? port : 0,
  ctx: {
    appName: APP_NAME,
    appVersion: APP_VERSION,
    runtime: 'browser',
    demoDir: path.join(appRoot, 'demo'),
    instanceId: randomUUID(),
    printToPdf: chromiumPrinter(),
    ...browserHostFolders(),
  },
});

console.log(`Plumbline ${APP_VERSION} is ready. Open this address in your browser (it holds this run's access token):`);
console.log(`  ${host.url}`);
console.log('Only this computer can reach it. Press Ctrl+C to stop.');

const stop = (): void => {
  void host.close().finally(() => process.exit(0));
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
