/**
 * Bench cases for the run catalogue, on 1,000 small runs (a header and 12 results each):
 * - list-1000-runs: a listing by a catalogue that has listed the folder before (journals unchanged:
 *   one stat per run, no journal re-read);
 * - list-1000-runs-cold: a listing by a new catalogue (every journal read, verified and replayed).
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import type { PlanSpec } from '../../../src-main/engine/index.js';
import { createRunCatalogue, type RunCatalogue } from '../../../src-main/inspection/index.js';
import { benchCase } from '../benchCase.js';
import { benchFolder, benchJournalText } from '../benchJournal.js';

const RUNS = 1_000;
const spec: PlanSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.05, truncation: null, fit: 'wald' };
const RESULTS: Array<'pass' | 'fail'> = ['pass', 'pass', 'fail', 'pass', 'pass', 'pass', 'pass', 'pass', 'pass', 'pass', 'pass', 'pass'];

/** A data folder with RUNS run journals. */
function dataFolderWithRuns(): string {
  const data = benchFolder();
  const runs = path.join(data, 'runs');
  mkdirSync(runs, { recursive: true });
  const start = Date.parse('2026-01-05T08:00:00.000Z');
  for (let index = 0; index < RUNS; index += 1) {
    const runId = `run-20260105-${index.toString(16).padStart(8, '0')}`;
    writeFileSync(path.join(runs, `${runId}.journal`), benchJournalText(runId, spec, RESULTS, start + index * 60_000));
  }
  return data;
}

async function listed(catalogue: RunCatalogue): Promise<number> {
  const rows = await catalogue.listRuns();
  if (rows.length !== RUNS || rows.some((row) => row.outcome !== 'open')) throw new Error('the bench runs were not all listed as open');
  return rows.length;
}

export const cases = [
  benchCase<RunCatalogue>({
    name: 'list-1000-runs',
    description: 'list 1,000 unchanged runs through a catalogue that has listed them before: a stat per journal, rows kept in memory',
    setup: () => createRunCatalogue(dataFolderWithRuns()),
    run: listed,
    repeat: 21,
    warmup: 3,
  }),
  benchCase<string>({
    name: 'list-1000-runs-cold',
    description: 'list 1,000 runs through a new catalogue: every journal read, its chain verified and its entries replayed',
    setup: dataFolderWithRuns,
    run: (data) => listed(createRunCatalogue(data)),
    repeat: 7,
    warmup: 1,
  }),
];
