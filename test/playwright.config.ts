import { defineConfig } from '@playwright/test';
import { chromiumExecutable } from './e2e/support/chromiumExecutable.js';

export default defineConfig({
  testDir: './e2e',
  globalSetup: './e2e/support/playwrightGlobalSetup.ts',
  testMatch: /.*\.e2e\.ts$/,
  outputDir: './artifacts/playwright',
  timeout: 60_000,
  fullyParallel: false,
  workers: 1,
  reporter: [['list']],
  use: {
    viewport: { width: 1280, height: 800 },
    launchOptions: {
      executablePath: chromiumExecutable(),
      args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'],
    },
  },
});
