import { existsSync } from 'node:fs';

/**
 * The system Chromium the browser tests drive (Playwright's own browser download does not work
 * everywhere). Missing is an error that names the install step, never a silent skip.
 */
export function chromiumExecutable(): string {
  const candidates = [process.env.CHROMIUM_PATH, '/usr/bin/chromium', '/usr/bin/chromium-browser'].filter(Boolean) as string[];
  const found = candidates.find((path) => existsSync(path));
  if (!found) {
    throw new Error(
      'No Chromium for the browser tests. Install it (Debian: `apt-get install -y chromium`) or set CHROMIUM_PATH to a Chromium or Chrome executable.',
    );
  }
  return found;
}
