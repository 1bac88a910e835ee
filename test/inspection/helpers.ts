/** Shared test helpers for inspection runs: a temp data directory with a source and a saved plan. */
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterEach } from 'vitest';
import type { PlanSpec, CountSpec, PassFailSpec } from '../../src-main/engine/index.js';
import { createRunService, type RunService } from '../../src-main/inspection/index.js';
import { PlanRepository, SourceRepository, type PlanVersion, type Source } from '../../src-main/store/index.js';

/** Wald plan with p0 1 %, p1 10 %, 5 % risks: a handful of failures rejects, a few dozen passes accept. */
export const passFailSpec: PassFailSpec = { model: 'passfail', p0: 0.01, p1: 0.1, alpha: 0.05, beta: 0.05 };
export const countSpec: CountSpec = { model: 'count', lambda0: 0.1, lambda1: 0.5, alpha: 0.05, beta: 0.05 };

const cleanups: (() => Promise<void>)[] = [];
afterEach(async () => {
  for (const cleanup of cleanups.splice(0).reverse()) await cleanup();
});

export interface Workspace {
  readonly data: string;
  readonly service: RunService;
  readonly source: Source;
  readonly plan: PlanVersion;
}

export async function workspace(spec: PlanSpec = passFailSpec): Promise<Workspace> {
  const data = await mkdtemp(path.join(os.tmpdir(), 'tallyline-inspection-'));
  const service = createRunService({ dataDirectory: data });
  cleanups.push(() => rm(data, { recursive: true, force: true }));
  cleanups.push(() => service.close());
  const source = await new SourceRepository(data).create({ name: 'Acme Castings' });
  const plan = await new PlanRepository(data).save({ name: 'Incoming housings', sourceId: source.id, spec });
  return { data, service, source, plan };
}
