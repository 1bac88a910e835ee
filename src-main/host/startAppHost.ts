import { homedir } from 'node:os';
import { createDispatcher } from '../api/dispatcher.js';
import { createHandlers } from '../api/handlers/index.js';
import { rendererRoot } from '../appPaths.js';
import { resolveDataDirectory } from '../store/dataDirectory.js';
import { startBrowserHost, type BrowserHost } from './browserHost.js';

/** Starts the browser host with the real handlers, reading --port and --data-dir from argv. */
export async function startAppHost(argv: string[]): Promise<BrowserHost & { dataDirectory: string }> {
  const dataDirectory = resolveDataDirectory({ argv, env: process.env, platform: process.platform, home: homedir() });
  const portFlag = argv.indexOf('--port');
  const port = portFlag >= 0 ? Number(argv[portFlag + 1]) : 0;
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    throw new Error(`--port must be a whole number from 0 to 65535 (got ${argv[portFlag + 1]}).`);
  }
  const dispatch = createDispatcher(createHandlers({ dataDirectory }));
  const host = await startBrowserHost({ rendererRoot, dispatch, port });
  return { ...host, dataDirectory };
}
