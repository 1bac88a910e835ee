import { describe, expect, it } from 'vitest';
import { findChromium, NoChromiumError, type ChromiumSearch } from '../e2e/support/chromiumExecutable.js';

const playwrightPath = '/home/ci/.cache/ms-playwright/chromium-1234/chrome-linux/chrome';

function search(files: string[], options: { env?: Record<string, string>; install?: (files: string[]) => string } = {}): ChromiumSearch & { installs: number } {
  const present = new Set(files);
  const result = {
    installs: 0,
    env: options.env ?? {},
    exists: (path: string) => present.has(path),
    playwrightChromium: () => playwrightPath,
    installPlaywrightChromium: () => {
      result.installs += 1;
      const outcome = options.install?.(files) ?? 'getaddrinfo ENOTFOUND cdn.playwright.dev';
      if (outcome === '') present.add(playwrightPath);
      return outcome;
    },
  };
  return result;
}

describe('findChromium', () => {
  it('takes CHROMIUM_PATH first, before a system Chromium', () => {
    const machine = search(['/opt/chrome/chrome', '/usr/bin/chromium'], { env: { CHROMIUM_PATH: '/opt/chrome/chrome' } });
    expect(findChromium(machine)).toBe('/opt/chrome/chrome');
    expect(machine.installs).toBe(0);
  });

  it('refuses a CHROMIUM_PATH that does not exist, naming it, instead of quietly using another', () => {
    const machine = search(['/usr/bin/chromium'], { env: { CHROMIUM_PATH: '/opt/missing/chrome' } });
    expect(() => findChromium(machine)).toThrow(/^CHROMIUM_PATH is \/opt\/missing\/chrome, which does not exist/);
  });

  it("finds Debian's chromium, then chromium-browser", () => {
    expect(findChromium(search(['/usr/bin/chromium', '/usr/bin/chromium-browser']))).toBe('/usr/bin/chromium');
    expect(findChromium(search(['/usr/bin/chromium-browser']))).toBe('/usr/bin/chromium-browser');
  });

  it("uses Playwright's own Chromium when it is already installed, without installing again", () => {
    const machine = search([playwrightPath]);
    expect(findChromium(machine)).toBe(playwrightPath);
    expect(machine.installs).toBe(0);
  });

  it("installs Playwright's Chromium when there is none and the download works", () => {
    const machine = search([], { install: () => '' });
    expect(findChromium(machine)).toBe(playwrightPath);
    expect(machine.installs).toBe(1);
  });

  it('stops with one line saying what to install when nothing can be had', () => {
    const machine = search([]);
    let error: unknown;
    try {
      findChromium(machine);
    } catch (caught) {
      error = caught;
    }
    expect(error).toBeInstanceOf(NoChromiumError);
    const message = (error as Error).message;
    expect(message.split('\n')).toHaveLength(1);
    expect(message).toContain('getaddrinfo ENOTFOUND cdn.playwright.dev');
    expect(message).toContain('apt-get install -y chromium');
    expect(message).toContain('CHROMIUM_PATH');
    expect(machine.installs).toBe(1);
  });

  it('stops the same way when the installer reports success but left no browser', () => {
    const machine = search([], { install: () => 'left-nothing' });
    expect(() => findChromium({ ...machine, installPlaywrightChromium: () => '' })).toThrow(/it installed nothing/);
  });
});
