/**
 * `npm start`: the desktop window when the Electron runtime is installed; otherwise one line
 * saying so, and the browser host, with the address to open.
 */
import { spawn, spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { appRoot } from './appPaths.js';
import { startAppHost } from './host/startAppHost.js';
import { findElectronRuntime, tryDownloadElectronRuntime } from './launch/electronRuntime.js';

const argv = process.argv.slice(2);
let runtime = findElectronRuntime(appRoot);
if (runtime === null && tryDownloadElectronRuntime(appRoot)) runtime = findElectronRuntime(appRoot);

if (runtime !== null) {
  // The Electron shell runs compiled JavaScript; the browser host runs the TypeScript directly.
  const build = spawnSync('npm', ['run', '--silent', 'build:main'], { cwd: appRoot, stdio: 'inherit', shell: process.platform === 'win32' });
  if (build.status !== 0) process.exit(build.status ?? 1);
  const child = spawn(runtime, [join(appRoot, 'build', 'main', 'electron', 'main.js'), ...argv], { stdio: 'inherit' });
  child.on('exit', (code) => process.exit(code ?? 0));
} else {
  console.log('The Electron runtime is not installed and could not be downloaded, so Tallyline runs in your browser instead.');
  const host = await startAppHost(argv);
  console.log(`Open ${host.url}  (data: ${host.dataDirectory}; Ctrl+C to stop)`);
  const stop = () => void host.close().then(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}
