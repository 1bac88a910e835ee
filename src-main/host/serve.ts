/**
 * `npm run serve`: the browser host. Serves the built renderer and the channel contract on
 * 127.0.0.1 and prints the address to open. Flags: --port N, --data-dir DIR.
 */
import { startAppHost } from './startAppHost.js';

const host = await startAppHost(process.argv.slice(2));
console.log(`Tallyline is served at ${host.url}`);
const stop = () => void host.close().then(() => process.exit(0));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
