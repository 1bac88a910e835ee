import { defineConfig } from '@playwright/test';
import { chromiumExecutable, NoChromiumError } from './e2e/support/chromiumExecutable.js';

/** The Chromium to drive; when none can be had, one line saying what to install, and the run stops. */
function browserExecutable(): string {
  try {
    return chromiumExecutable();
  } catch (error) {
    if (!(error instanceof NoChromiumError)) throw error;
    process.stderr.write(`${error.message}\n`);
    process.exit(1);
  }
}

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
      executablePath: browserExecutable(),
      args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'],
    },
  },
});
