import { buildIfStale } from '../../support/buildIfStale.js';

/** Once per Playwright run: the browser host runs compiled build/main and serves build/renderer. */
export default function globalSetup(): void {
  buildIfStale(['main', 'renderer']);
}
