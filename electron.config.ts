/**
 * electron-builder configuration (`npm run dist`). Packaging needs the Electron runtime
 * download, so it runs only where that host is reachable.
 */
import type { Configuration } from 'electron-builder';

const configuration: Configuration = {
  appId: 'org.tallyline.desktop',
  productName: 'Tallyline',
  copyright: 'Copyright © 2026 the Tallyline authors',
  directories: { output: 'release', buildResources: 'assets' },
  // What the app runs, nothing else: the compiled main side and renderer (not their build stamps or
  // anything else left in build/), the record fonts and the icon; from the production dependencies,
  // no TypeScript sources, declarations, source maps or pdfkit's browser builds.
  files: [
    'package.json',
    'build/main/**/*',
    'build/renderer/**/*',
    'assets/fonts/**/*',
    'assets/icon.png',
    '!**/*.map',
    '!build/*/.build-inputs.json',
    '!build/renderer/.bundle-modules.json',
    '!node_modules/**/*.ts',
    '!node_modules/**/*.d.cts',
    '!node_modules/**/*.d.mts',
    '!node_modules/zod/src/**',
    '!node_modules/pdfkit/js/pdfkit.browser*',
    '!node_modules/pdfkit/js/pdfkit.standalone.js',
  ],
  extraMetadata: { main: 'build/main/electron/main.js' },
  asar: true,
  linux: {
    target: ['AppImage', 'deb'],
    category: 'Science',
    icon: 'assets/icon.png',
    maintainer: 'Tallyline authors',
  },
  // No deb.depends: electron-builder's default list (GTK, NSS, libnotify, xdg-utils to open a
  // record PDF, libsecret, ...) is what the runtime needs; a list here would replace it, not add to it.
  // Electron fuses, flipped in the packaged binary: no ELECTRON_RUN_AS_NODE, NODE_OPTIONS or
  // --inspect entry points, and the app code only from its integrity-checked asar.
  electronFuses: {
    runAsNode: false,
    enableCookieEncryption: true,
    enableNodeOptionsEnvironmentVariable: false,
    enableNodeCliInspectArguments: false,
    enableEmbeddedAsarIntegrityValidation: true,
    onlyLoadAppFromAsar: true,
    grantFileProtocolExtraPrivileges: false,
  },
  win: { target: ['nsis'], icon: 'assets/icon.png' },
  nsis: { oneClick: false, allowToChangeInstallationDirectory: true, perMachine: false },
  mac: { target: ['dmg'], category: 'public.app-category.productivity', icon: 'assets/icon.png' },
};

export default configuration;
