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
  files: ['build/**/*', 'assets/**/*', 'package.json', '!**/*.map'],
  extraMetadata: { main: 'build/main/electron/main.js' },
  asar: true,
  linux: {
    target: ['AppImage', 'deb'],
    category: 'Science',
    icon: 'assets/icon.png',
    maintainer: 'Tallyline authors',
  },
  deb: { depends: ['libnss3', 'libgtk-3-0'] },
  win: { target: ['nsis'], icon: 'assets/icon.png' },
  nsis: { oneClick: false, allowToChangeInstallationDirectory: true, perMachine: false },
  mac: { target: ['dmg'], category: 'public.app-category.productivity', icon: 'assets/icon.png' },
};

export default configuration;
