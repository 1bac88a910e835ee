/**
 * Valid run journals written in one go for the bench cases (the format, not the fsync path, is what
 * a reload or a listing reads), and a temp folder removed when the process exits.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { PlanSpec } from '../../src-main/engine/index.js';
import { GENESIS_HASH, JOURNAL_FORMAT, PLAN_FORMAT, entryLine, lineHash, type JournalEntry } from '../../src-main/store/index.js';

/** The text of a journal: its open header, then one result entry per given result. */
export function benchJournalText(runId: string, spec: PlanSpec, results: ReadonlyArray<'pass' | 'fail'>, startMs: number): string {
  const plan = { format: PLAN_FORMAT, id: 'plan-bench', version: 1, name: 'bench', sourceId: 'src-bench', spec, createdAt: new Date(startMs).toISOString() };
  const run = { id: runId, planId: plan.id, planVersion: 1, sourceId: 'src-bench', lot: runId, lotSize: null, inspector: null, note: null, createdAt: plan.createdAt };
  const lines: string[] = [];
  let previous = GENESIS_HASH;
  const push = (kind: JournalEntry['kind'], payload: unknown): void => {
    const seq = lines.length;
    const line = entryLine({ seq, time: new Date(startMs + seq * 1000).toISOString(), offset: '+00:00', actor: 'bench', kind, payload, previous });
    lines.push(line);
    previous = lineHash(line);
  };
  push('open', { format: JOURNAL_FORMAT, run, plan, source: { id: 'src-bench', name: 'Bench' } });
  results.forEach((result, index) => push('result', { itemId: `SN-${index + 1}`, result, category: null, note: null }));
  return lines.join('\n') + '\n';
}

/** A temp folder for a bench case (the runner has no teardown for setup files): removed when the process exits. */
export function benchFolder(): string {
  const folder = mkdtempSync(path.join(os.tmpdir(), 'tallyline-bench-'));
  process.once('exit', () => rmSync(folder, { recursive: true, force: true }));
  return folder;
}
