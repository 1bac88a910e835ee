#!/usr/bin/env node
// The `tallyline` bin: runs the compiled CLI (build/main/cli.js) in this process. In a source
// checkout it first rebuilds the main side when its sources changed (scripts/build.mjs, quiet
// when up to date). Paths resolve from this file's location, so it works from any working directory.
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const builder = new URL('../../scripts/build.mjs', import.meta.url);
if (existsSync(fileURLToPath(builder))) {
  const { ensureBuilt } = await import(builder.href);
  ensureBuilt(['main']);
}
await import(new URL('../../build/main/cli.js', import.meta.url).href);
