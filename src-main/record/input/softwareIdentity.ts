/**
 * The software that issues a record: name and version from the app's package.json, found by
 * walking up from this module (the same from the sources and from the build output).
 */
import { readFile } from 'node:fs/promises';
import { dirname, join, parse } from 'node:path';
import { fileURLToPath } from 'node:url';

export interface SoftwareIdentity {
  readonly name: string;
  readonly version: string;
}

let cached: Promise<SoftwareIdentity> | null = null;

async function findIdentity(startDirectory: string): Promise<SoftwareIdentity> {
  for (let directory = startDirectory; ; directory = dirname(directory)) {
    const text = await readFile(join(directory, 'package.json'), 'utf8').catch(() => null);
    if (text !== null) {
      const found = JSON.parse(text) as { name?: unknown; productName?: unknown; version?: unknown };
      if (found.name === 'tallyline' && typeof found.version === 'string') {
        return { name: typeof found.productName === 'string' ? found.productName : 'Tallyline', version: found.version };
      }
    }
    if (directory === parse(directory).root) throw new Error(`decision record: Tallyline's package.json not found above ${startDirectory}`);
  }
}

/** Tallyline's product name and version; read once per process. */
export function softwareIdentity(): Promise<SoftwareIdentity> {
  cached ??= findIdentity(dirname(fileURLToPath(import.meta.url)));
  return cached;
}
