import { describe, expect, it } from 'vitest';
import path from 'node:path';
import { resolveDataDirectory } from '../../src-main/store/dataDirectory.js';

const base = { argv: [] as string[], env: {}, platform: 'linux', home: '/home/quality' };

describe('resolveDataDirectory', () => {
  it('uses the --data-dir flag before anything else', () => {
    const found = resolveDataDirectory({ ...base, argv: ['feed', '--data-dir', '/srv/t'], env: { TALLYLINE_DATA: '/env' } });
    expect(found).toBe(path.resolve('/srv/t'));
  });

  it('accepts the --data-dir=DIR spelling', () => {
    expect(resolveDataDirectory({ ...base, argv: ['--data-dir=/srv/u'] })).toBe(path.resolve('/srv/u'));
  });

  it('refuses a --data-dir flag without a folder', () => {
    expect(() => resolveDataDirectory({ ...base, argv: ['--data-dir'] })).toThrow(/--data-dir needs a folder/);
  });

  it('uses TALLYLINE_DATA when there is no flag', () => {
    expect(resolveDataDirectory({ ...base, env: { TALLYLINE_DATA: '/data/t' } })).toBe(path.resolve('/data/t'));
  });

  it('uses XDG_DATA_HOME on Linux when it is absolute', () => {
    expect(resolveDataDirectory({ ...base, env: { XDG_DATA_HOME: '/x/share' } })).toBe('/x/share/Tallyline');
  });

  it('falls back to ~/.local/share on Linux, ignoring a relative XDG_DATA_HOME', () => {
    expect(resolveDataDirectory({ ...base, env: { XDG_DATA_HOME: 'rel' } })).toBe('/home/quality/.local/share/Tallyline');
  });

  it("uses Application Support on macOS, beside Electron's own profile folder (Tallyline), not in it", () => {
    expect(resolveDataDirectory({ ...base, platform: 'darwin', home: '/Users/q' })).toBe(
      '/Users/q/Library/Application Support/Tallyline Data',
    );
  });

  it("uses %APPDATA% on Windows, beside Electron's own profile folder (Tallyline), not in it", () => {
    const found = resolveDataDirectory({ ...base, platform: 'win32', env: { APPDATA: 'C:\\Users\\q\\AppData\\Roaming' } });
    expect(found).toBe('C:\\Users\\q\\AppData\\Roaming\\Tallyline Data');
  });
});
