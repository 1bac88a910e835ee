import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';

/** What the finder may look at and do; the real ones below, fakes in its unit test. */
export interface ChromiumSearch {
  env: Readonly<Record<string, string | undefined>>;
  exists: (path: string) => boolean;
  /** Where Playwright's own Chromium is (or would be, once installed). */
  playwrightChromium: () => string;
  /** Runs `playwright install chromium`; resolves to '' on success or what went wrong. */
  installPlaywrightChromium: () => string;
}

/** Debian's and other distributions' Chromium. */
export const systemChromiumPaths = ['/usr/bin/chromium', '/usr/bin/chromium-browser'] as const;

export class NoChromiumError extends Error {
  override name = 'NoChromiumError';
}

/**
 * The Chromium the browser tests drive, in this order: CHROMIUM_PATH (which must exist), the
 * system's Chromium (Debian: `apt-get install -y chromium`), Playwright's own Chromium when it is
 * already installed, else Playwright's own installed now (`playwright install chromium`, which needs
 * the download host). When none can be had it throws one line naming what to install: never a
 * silent skip.
 */
export function findChromium(search: ChromiumSearch): string {
  const configured = search.env.CHROMIUM_PATH;
  if (configured !== undefined && configured !== '') {
    if (search.exists(configured)) return configured;
    throw new NoChromiumError(`CHROMIUM_PATH is ${configured}, which does not exist: point it at a Chromium or Chrome executable, or unset it.`);
  }
  const system = systemChromiumPaths.find((path) => search.exists(path));
  if (system !== undefined) return system;
  const playwrights = search.playwrightChromium();
  if (search.exists(playwrights)) return playwrights;
  const failure = search.installPlaywrightChromium();
  if (failure === '' && search.exists(playwrights)) return playwrights;
  throw new NoChromiumError(
    `No Chromium for the browser tests and \`playwright install chromium\` could not fetch one (${failure === '' ? 'it installed nothing' : failure}): install Chromium (Debian: apt-get install -y chromium) or set CHROMIUM_PATH to a Chromium or Chrome executable.`,
  );
}

const require = createRequire(import.meta.url);

/** The real search: this machine's files, Playwright's registry, and its installer. */
export const machineSearch: ChromiumSearch = {
  env: process.env,
  exists: existsSync,
  playwrightChromium: () => (require('@playwright/test') as typeof import('@playwright/test')).chromium.executablePath(),
  installPlaywrightChromium: () => {
    process.stderr.write('No system Chromium: installing Playwright\'s own (playwright install chromium)...\n');
    const outcome = spawnSync(process.execPath, [require.resolve('@playwright/test/cli'), 'install', 'chromium'], { stdio: ['ignore', 'inherit', 'pipe'], timeout: 600_000, encoding: 'utf8' });
    if (outcome.error) return outcome.error.message;
    if (outcome.status !== 0) return (outcome.stderr ?? '').trim().split('\n').filter(Boolean).at(-1) ?? `exit code ${outcome.status}`;
    return '';
  },
};

let found: string | null = null;

/** The Chromium for this test run (looked up, and installed if need be, once per process). */
export function chromiumExecutable(): string {
  found ??= findChromium(machineSearch);
  return found;
}
