/**
 * Bench cases for the run journal: append latency with fsync (median and p99), and the reload of a
 * 10,000-entry run (read, verify the chain, replay, recompute the state).
 * Runnable alone: `npx tsx test/bench/cases/journal.ts` prints one JSON object per case.
 */
import { mkdtemp, rm, writeFile, mkdir } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type { PlanSpec } from '../../../src-main/engine/index.js';
import { createRunService } from '../../../src-main/inspection/index.js';
import {
  GENESIS_HASH,
  JOURNAL_FORMAT,
  JournalWriter,
  PLAN_FORMAT,
  entryLine,
  layout,
  lineHash,
  type JournalEntry,
} from '../../../src-main/store/index.js';

export interface JournalBenchCase {
  readonly name: string;
  /** Runs the case; resolves to its measurements (times in milliseconds). */
  run(): Promise<Record<string, number>>;
}

const APPENDS = 500;
const RELOAD_RESULTS = 10_000;
const RELOAD_REPEATS = 7;

function percentile(sorted: readonly number[], fraction: number): number {
  return sorted[Math.min(sorted.length - 1, Math.ceil(fraction * sorted.length) - 1)];
}

async function inTempFolder<Value>(work: (folder: string) => Promise<Value>): Promise<Value> {
  const folder = await mkdtemp(path.join(os.tmpdir(), 'tallyline-bench-'));
  try {
    return await work(folder);
  } finally {
    await rm(folder, { recursive: true, force: true });
  }
}

const appendLatency: JournalBenchCase = {
  name: 'journal append latency (write + fsync, one at a time)',
  run: () =>
    inTempFolder(async (folder) => {
      const { writer } = await JournalWriter.create(path.join(folder, 'bench.journal'), 'bench', {});
      const times: number[] = [];
      for (let index = 0; index < APPENDS; index += 1) {
        const started = process.hrtime.bigint();
        await writer.append('result', 'bench', { itemId: `SN-${index}`, result: 'pass', category: null, note: null });
        times.push(Number(process.hrtime.bigint() - started) / 1e6);
      }
      await writer.close();
      times.sort((a, b) => a - b);
      return { appends: APPENDS, medianMs: percentile(times, 0.5), p99Ms: percentile(times, 0.99), maxMs: times.at(-1) ?? 0 };
    }),
};

/** Wald plan whose acceptance and rejection lines a result pattern near the midline never leaves. */
const reloadSpec: PlanSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.05, truncation: null, fit: 'wald' };
const MIDLINE_SLOPE = Math.log(0.99 / 0.9) / (Math.log(10) + Math.log(0.99 / 0.9));

/** Write a valid 10,000-result journal in one go (the format, not the fsync path, is what reload reads). */
export async function writeLongRun(data: string, runId: string): Promise<void> {
  const start = new Date('2026-01-05T08:00:00.000Z').getTime();
  const plan = { format: PLAN_FORMAT, id: 'plan-bench', version: 1, name: 'bench', sourceId: 'src-bench', spec: reloadSpec, createdAt: new Date(start).toISOString() };
  const run = { id: runId, planId: plan.id, planVersion: 1, sourceId: 'src-bench', lot: 'L', lotSize: null, inspector: null, note: null, createdAt: plan.createdAt };
  const lines: string[] = [];
  let previous = GENESIS_HASH;
  let total = 0;
  const push = (kind: JournalEntry['kind'], payload: unknown): void => {
    const seq = lines.length;
    const line = entryLine({ seq, time: new Date(start + seq * 1000).toISOString(), offset: '+00:00', actor: 'bench', kind, payload, previous });
    lines.push(line);
    previous = lineHash(line);
  };
  push('open', { format: JOURNAL_FORMAT, run, plan, source: { id: 'src-bench', name: 'Bench' } });
  for (let n = 1; n <= RELOAD_RESULTS; n += 1) {
    // Fail whenever the count falls below the midline s n: the path stays between the two lines.
    const fail = total < MIDLINE_SLOPE * n;
    total += fail ? 1 : 0;
    push('result', { itemId: `SN-${n}`, result: fail ? 'fail' : 'pass', category: null, note: null });
  }
  await mkdir(layout.runsFolder(data), { recursive: true });
  await writeFile(layout.runJournal(data, runId), lines.join('\n') + '\n');
}

const reloadLongRun: JournalBenchCase = {
  name: 'reload of a 10,000-entry run (read, verify chain, replay, recompute state)',
  run: () =>
    inTempFolder(async (data) => {
      await writeLongRun(data, 'run-bench');
      const times: number[] = [];
      let decision = '';
      for (let repeat = 0; repeat < RELOAD_REPEATS; repeat += 1) {
        const service = createRunService({ dataDirectory: data });
        const started = process.hrtime.bigint();
        const view = await service.readRun('run-bench');
        times.push(Number(process.hrtime.bigint() - started) / 1e6);
        await service.close();
        if (view.problems.length > 0 || view.state.n !== RELOAD_RESULTS) throw new Error('bench journal did not reload intact');
        decision = view.state.decision;
      }
      times.sort((a, b) => a - b);
      if (decision !== 'continue') throw new Error(`bench run left the continue region (${decision})`);
      return { entries: RELOAD_RESULTS + 1, medianMs: percentile(times, 0.5), maxMs: times.at(-1) ?? 0 };
    }),
};

export const cases: readonly JournalBenchCase[] = [appendLatency, reloadLongRun];
export default cases;

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  for (const benchCase of cases) {
    process.stdout.write(`${JSON.stringify({ case: benchCase.name, ...(await benchCase.run()) })}\n`);
  }
}
