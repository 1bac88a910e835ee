/**
 * A stand-in for the Electron runtime folder that electron-builder packs (its `electronDist`), for
 * packaging where Electron cannot be downloaded. Its `electron` executable is a Node script: it
 * unpacks the app's `resources/app.asar` into a temp folder (once per archive) and runs the app's built main
 * process there under the recording `electron` stand-in (electronStandIn.ts), as the packaged
 * executable would, with the packaged app's argv (no app folder argument).
 *
 * The script carries an Electron fuse wire (sentinel, version 1, eight fuses, Electron's defaults)
 * in a comment, so electron-builder's fuse step flips it as it would in the real binary and a test
 * can read the result with @electron/fuses.
 */
import { chmodSync, mkdirSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';

const require = createRequire(import.meta.url);

/** @electron/fuses's sentinel, then wire version 1, 8 fuses: RunAsNode on, cookie encryption off, NODE_OPTIONS on, inspect on, asar integrity off, only-asar off, browser V8 snapshot off, file:// privileges on. */
const FUSE_WIRE = `dL7pKGdnNz796PbbjQWNKmHXBZaB9tsX${String.fromCharCode(1, 8)}10110001`;

/**
 * Writes the stand-in runtime folder: `electron` (the launcher), `LICENSE`, `LICENSES.chromium.html`,
 * `version` and an empty `resources/`.
 * @param registerFile the compiled `electronStandInRegister.mjs` (electronStandInDriver.buildElectronStandIn)
 */
export function assembleStandInElectronDist(folder: string, registerFile: string, electronVersion: string): string {
  mkdirSync(join(folder, 'resources'), { recursive: true });
  const asarModule = require.resolve('@electron/asar');
  const launcher = `#!/usr/bin/env node
// Stand-in for the Electron executable, made by test/support/electronStandInDist.ts (no Chromium here).
// fuse wire: ${FUSE_WIRE}
'use strict';
const { existsSync, mkdtempSync, rmSync } = require('node:fs');
const { tmpdir } = require('node:os');
const { dirname, join } = require('node:path');
const { pathToFileURL } = require('node:url');
const { extractAll } = require(${JSON.stringify(asarModule)});

const resources = join(dirname(require('node:fs').realpathSync(__filename)), 'resources');
const archive = join(resources, 'app.asar');
if (!existsSync(archive)) {
  console.error('stand-in electron: no resources/app.asar');
  process.exit(3);
}
// Unpacked once per archive (path, size and time as the key) and reused by later runs.
const { size, mtimeMs } = require('node:fs').statSync(archive);
const key = require('node:crypto').createHash('sha256').update(archive + '|' + size + '|' + mtimeMs).digest('hex').slice(0, 16);
const unpacked = join(tmpdir(), 'electron-stand-in-app-' + key);
if (!existsSync(join(unpacked, 'package.json'))) {
  const fresh = mkdtempSync(join(tmpdir(), 'electron-stand-in-unpacking-'));
  extractAll(archive, fresh);
  try {
    require('node:fs').renameSync(fresh, unpacked);
  } catch {
    rmSync(fresh, { recursive: true, force: true }); // another run unpacked it first
  }
}
const manifest = require(join(unpacked, 'package.json'));
process.env.ELECTRON_STAND_IN_PACKAGED = '1';
process.env.ELECTRON_STAND_IN_MAIN = join(unpacked, manifest.main);
import(${JSON.stringify(pathToFileURL(registerFile).href)})
  .then(() => import(pathToFileURL(process.env.ELECTRON_STAND_IN_MAIN).href))
  .catch((error) => {
    console.error(error);
    process.exit(1);
  });
`;
  const executable = join(folder, 'electron');
  writeFileSync(executable, launcher);
  chmodSync(executable, 0o755);
  writeFileSync(join(folder, 'LICENSE'), 'Stand-in for the Electron runtime (test only).\n');
  writeFileSync(join(folder, 'LICENSES.chromium.html'), '<p>Stand-in: no Chromium.</p>\n');
  writeFileSync(join(folder, 'version'), electronVersion);
  return executable;
}
