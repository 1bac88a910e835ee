/**
 * Runs made through the real run service in a temporary data folder, for the record glue, the
 * record CLI and the history channels. Every name here is invented: the sources, parts, lots and
 * people do not exist.
 */
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import type { PlanSpec, LinearCountSpec } from '../../src-main/engine/index.js';
import { createRunService, type ResultInput, type RunService } from '../../src-main/inspection/index.js';
import { PlanRepository, SettingsRepository, SourceRepository, type PlanVersion, type Source } from '../../src-main/store/index.js';

/** p0 1 %, p1 10 %, 5 % risks, untruncated: 0 failures accept at 31 items, 1 failure at 57 (engine's decide). */
export const incomingSpec: LinearCountSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.05 };
/** A plan that separates close qualities, so 500 passes are still undecided (acceptance needs about 2 900). */
export const slowSpec: LinearCountSpec = { model: 'passfail', p0: 0.001, p1: 0.002, alpha: 0.05, beta: 0.05 };

export const INVENTED_ORGANISATION = 'Northgate Assembly Ltd (invented)';
export const INVENTED_SITE = 'Plant 2, goods-in inspection (invented)';

/** A clock that moves 20 s on every reading, from a fixed start: times in the journal are predictable. */
export function steppingClock(startUtc: string, stepSeconds = 20): () => Date {
  let at = Date.parse(startUtc);
  return () => {
    const now = new Date(at);
    at += stepSeconds * 1000;
    return now;
  };
}

export interface RecordWorkspace {
  readonly data: string;
  readonly service: RunService;
  readonly sources: SourceRepository;
  readonly plans: PlanRepository;
  cleanup(): Promise<void>;
}

export async function recordWorkspace(clock = steppingClock('2025-03-14T07:30:00.000Z')): Promise<RecordWorkspace> {
  const data = await mkdtemp(path.join(os.tmpdir(), 'tallyline-record-run-'));
  const service = createRunService({ dataDirectory: data, clock });
  await new SettingsRepository(data).update({ organisationName: INVENTED_ORGANISATION, site: INVENTED_SITE, confidenceLevel: 0.9 });
  return {
    data,
    service,
    sources: new SourceRepository(data, clock),
    plans: new PlanRepository(data, clock),
    async cleanup() {
      await service.close();
      await rm(data, { recursive: true, force: true });
    },
  };
}

export async function sourceWithPlan(
  space: RecordWorkspace,
  sourceName: string,
  planName: string,
  spec: PlanSpec,
  checks: { part?: string; characteristic?: string } = {},
): Promise<{ source: Source; plan: PlanVersion }> {
  const source = (await space.sources.findOrCreate(sourceName)).source;
  const plan = await space.plans.save({ name: planName, sourceId: source.id, spec, ...checks });
  return { source, plan };
}

/** Feeds results until the run closes (or they run out); returns how many were taken. */
export async function feedUntilClosed(service: RunService, runId: string, results: Iterable<ResultInput>): Promise<number> {
  let taken = 0;
  for (const result of results) {
    const outcome = await service.recordResult(runId, result);
    taken += 1;
    if (outcome.closedWith !== null) break;
  }
  return taken;
}

/** `count` conforming items with ids `<prefix>-0001`... by one inspector. */
export function* passes(prefix: string, count: number, actor: string, from = 1): Generator<ResultInput> {
  for (let i = from; i < from + count; i++) yield { itemId: `${prefix}-${String(i).padStart(4, '0')}`, result: 'pass', actor };
}

/**
 * The decided run of the record tests, at Kestrel Fasteners (invented supplier): 10 passes, one
 * nonconforming item with a category and a note, one result keyed against the wrong item and
 * voided by a second inspector (the item is then gauged again), then passes until the plan accepts (1 nonconforming: at 57 items).
 */
export async function decidedKestrelRun(space: RecordWorkspace): Promise<{ runId: string; planId: string }> {
  const { source, plan } = await sourceWithPlan(space, 'Kestrel Fasteners (invented)', 'M6 flange nut, thread gauge', incomingSpec, {
    part: 'M6 flange nut, zinc flake',
    characteristic: 'Internal thread 6H, GO/NO-GO gauge',
  });
  const run = await space.service.startRun({ planId: plan.id, sourceId: source.id, lot: 'KF-25-0311', lotSize: 20000, inspector: 'A. Brennan' });
  const runId = run.run.id;
  for (const result of passes('KF', 10, 'A. Brennan')) await space.service.recordResult(runId, result);
  await space.service.recordResult(runId, { itemId: 'KF-0011', result: 'fail', category: 'thread damage', note: 'NO-GO gauge entered 2 turns, part "quarantined", tray 4', actor: 'A. Brennan' });
  await space.service.recordResult(runId, { itemId: 'KF-0012', result: 'pass', actor: 'A. Brennan' });
  await space.service.voidLastEntry(runId, 'keyed against the wrong tray position, re-gauged', 'T. Okafor');
  await feedUntilClosed(space.service, runId, passes('KF', 100, 'A. Brennan', 12));
  return { runId, planId: plan.id };
}
