import { buildIfStale } from './buildIfStale.js';

/** Once per Vitest run: the tests that spawn the CLI run the compiled build/main/cli.js. */
export default function setup(): void {
  buildIfStale(['main']);
}
