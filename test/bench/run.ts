/**
 * `npm run bench [-- name ...]`: runs every case exported from test/bench/cases/*.ts in this process
 * and prints one JSON object per line: {"case", "medianMs", "p99Ms", "minMs", "maxMs", "runs", "description"}.
 * A case whose run returns a promise is timed until the promise settles (e.g. a fsync'd append).
 */
import { readdirSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { BenchCase } from './benchCase.js';

const casesFolder = fileURLToPath(new URL('./cases/', import.meta.url));

async function loadCases(): Promise<BenchCase[]> {
  const files = readdirSync(casesFolder)
    .filter((file) => file.endsWith('.ts'))
    .sort();
  const cases: BenchCase[] = [];
  for (const file of files) {
    const module = (await import(pathToFileURL(casesFolder + file).href)) as { cases?: BenchCase[] };
    if (!Array.isArray(module.cases)) throw new Error(`test/bench/cases/${file} does not export cases: BenchCase[]`);
    cases.push(...module.cases);
  }
  const names = new Set<string>();
  for (const benchCase of cases) {
    if (names.has(benchCase.name)) throw new Error(`two bench cases are named ${benchCase.name}`);
    names.add(benchCase.name);
  }
  return cases;
}

function median(sorted: readonly number[]): number {
  const middle = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

const round = (ms: number): number => Math.round(ms * 1000) / 1000;

let sink: unknown;

/** Nearest-rank percentile of sorted times. */
function percentile(sorted: readonly number[], fraction: number): number {
  return sorted[Math.min(sorted.length - 1, Math.ceil(fraction * sorted.length) - 1)];
}

async function once(benchCase: BenchCase, state: unknown): Promise<unknown> {
  const result = benchCase.run(state);
  return result instanceof Promise ? await result : result;
}

async function measure(benchCase: BenchCase): Promise<Record<string, unknown>> {
  const state = await benchCase.setup?.();
  for (let i = 0; i < (benchCase.warmup ?? 5); i++) sink = await once(benchCase, state);
  const times: number[] = [];
  for (let i = 0; i < (benchCase.repeat ?? 21); i++) {
    const start = performance.now();
    sink = await once(benchCase, state);
    times.push(performance.now() - start);
  }
  await benchCase.teardown?.(state);
  times.sort((a, b) => a - b);
  return {
    case: benchCase.name,
    medianMs: round(median(times)),
    p99Ms: round(percentile(times, 0.99)),
    minMs: round(times[0]),
    maxMs: round(times[times.length - 1]),
    runs: times.length,
    description: benchCase.description,
  };
}

const wanted = process.argv.slice(2);
const cases = (await loadCases()).filter((benchCase) => wanted.length === 0 || wanted.includes(benchCase.name));
const medians = new Map<string, number>();
for (const benchCase of cases) {
  const measured = await measure(benchCase);
  medians.set(benchCase.name, measured.medianMs as number);
  const floor = benchCase.relativeTo === undefined ? undefined : medians.get(benchCase.relativeTo);
  if (floor !== undefined) measured.ratioToFloor = round((measured.medianMs as number) / floor);
  process.stdout.write(`${JSON.stringify(measured)}\n`);
}
if (sink === Symbol.for('never')) process.stdout.write('\n');
