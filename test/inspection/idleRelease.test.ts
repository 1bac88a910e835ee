import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { createRunService } from '../../src-main/inspection/index.js';
import { PlanRepository, SourceRepository } from '../../src-main/store/index.js';
import { passFailSpec } from './helpers.js';

const folders: string[] = [];
afterEach(async () => {
  await Promise.all(folders.splice(0).map((folder) => rm(folder, { recursive: true, force: true })));
});

const pause = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
/** Long enough that a loaded 2-core machine does not let the run go between two steps of the test. */
const IDLE_MS = 1_000;

describe('a run service lets go of an idle run', () => {
  it('keeps a run locked against a second writer while in use, and hands it over once idle', async () => {
    const data = await mkdtemp(path.join(os.tmpdir(), 'tallyline-idle-'));
    folders.push(data);
    const source = await new SourceRepository(data).create({ name: 'Kestrel Fasteners (invented)' });
    const plan = await new PlanRepository(data).save({ name: 'Flange nut', sourceId: source.id, spec: passFailSpec });
    const window = createRunService({ dataDirectory: data, idleReleaseMs: IDLE_MS });
    const station = createRunService({ dataDirectory: data, idleReleaseMs: IDLE_MS });
    try {
      const { run } = await window.startRun({ planId: plan.id, sourceId: source.id, lot: 'L-7' });
      await window.recordResult(run.id, { result: 'pass', actor: 'window' });
      await expect(station.recordResult(run.id, { result: 'pass', actor: 'station' })).rejects.toThrow(/cannot be written/);
      await pause(2.5 * IDLE_MS);
      const taken = await station.recordResult(run.id, { result: 'pass', actor: 'station' });
      expect(taken.state.n).toBe(2);
      await pause(2.5 * IDLE_MS);
      const back = await window.recordResult(run.id, { result: 'pass', actor: 'window' });
      expect(back.state.n).toBe(3); // the window re-reads the journal, so the station's entry counts
    } finally {
      await window.close();
      await station.close();
    }
  });
});
