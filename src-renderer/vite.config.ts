import { svelte } from '@sveltejs/vite-plugin-svelte';
import { writeFileSync } from 'node:fs';
import { isAbsolute, join, relative, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { defineConfig, type Plugin } from 'vite';

const here = fileURLToPath(new URL('.', import.meta.url));
const appRoot = fileURLToPath(new URL('..', import.meta.url));
const outDir = fileURLToPath(new URL('../build/renderer', import.meta.url));

/**
 * Lists the repo files outside src-renderer that the bundle is made of (the main side's types and
 * engine code it imports), so scripts/build.mjs knows when a change there makes the build stale.
 */
function listBundleModules(): Plugin {
  return {
    name: 'tallyline-list-bundle-modules',
    apply: 'build',
    writeBundle(_options, bundle) {
      const files = new Set<string>();
      const ids = Object.values(bundle).flatMap((output) => (output.type === 'chunk' ? output.moduleIds : []));
      for (const id of ids) {
        const path = id.split('?')[0];
        if (!isAbsolute(path)) continue;
        const fromRoot = relative(appRoot, path).split(sep).join('/');
        if (fromRoot.startsWith('..') || fromRoot.startsWith('node_modules/') || fromRoot.startsWith('src-renderer/')) continue;
        files.add(fromRoot);
      }
      writeFileSync(join(outDir, '.bundle-modules.json'), `${JSON.stringify([...files].sort(), null, 1)}\n`);
    },
  };
}

export default defineConfig({
  root: here,
  base: './',
  plugins: [svelte(), listBundleModules()],
  build: {
    outDir,
    emptyOutDir: true,
    target: 'es2022',
    sourcemap: true,
  },
});
