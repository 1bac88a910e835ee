/**
 * `npm start`: the desktop window when the Electron runtime is installed; otherwise one line
 * saying so, and the browser host, with the address to open. `npm start` builds what is stale
 * (scripts/build.mjs) before running this compiled file.
 */
import { spawn } from 'node:child_process';
import { appRoot } from './appPaths.js';
import { startAppHost } from './host/startAppHost.js';
import { electronLaunchArguments, findElectronRuntime, tryDownloadElectronRuntime } from './launch/electronRuntime.js';

const argv = process.argv.slice(2);
let runtime = findElectronRuntime(appRoot);
if (runtime === null && tryDownloadElectronRuntime(appRoot)) runtime = findElectronRuntime(appRoot);

if (runtime !== null) {
  const child = spawn(runtime, electronLaunchArguments(appRoot, argv), { stdio: 'inherit' });
  child.on('exit', (code) => process.exit(code ?? 0));
} else {
  console.log('The Electron runtime is not installed and could not be downloaded, so Tallyline runs in your browser instead.');
  const host = await startAppHost(argv);
  console.log(`Open ${host.url}  (data: ${host.dataDirectory}; Ctrl+C to stop)`);
  const stop = () => void host.close().then(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}
