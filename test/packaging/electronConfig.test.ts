import { describe, expect, it } from 'vitest';
import configuration from '../../electron.config.js';

describe('the packaging configuration', () => {
  it("keeps electron-builder's default Debian dependencies (a deb.depends list would replace them)", () => {
    expect(configuration.deb?.depends ?? null).toBeNull();
  });

  it('turns off the Node entry points of the packaged runtime and loads the app only from its checked asar', () => {
    expect(configuration.electronFuses).toMatchObject({
      runAsNode: false,
      enableNodeOptionsEnvironmentVariable: false,
      enableNodeCliInspectArguments: false,
      enableEmbeddedAsarIntegrityValidation: true,
      onlyLoadAppFromAsar: true,
      grantFileProtocolExtraPrivileges: false,
    });
    expect(configuration.asar).toBe(true);
  });
});
