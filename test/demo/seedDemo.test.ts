import { mkdtemp, readdir, rm, writeFile, mkdir } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { DEMO_ORGANISATION, DataFolderNotEmptyError, demoLots, demoPlans, demoSources, seedDemo } from '../../src-main/demo/index.js';
import { createRunCatalogue } from '../../src-main/inspection/index.js';
import { PlanRepository, SettingsRepository, SourceRepository, verifyJournal, layout } from '../../src-main/store/index.js';

const folders: string[] = [];
afterEach(async () => {
  for (const folder of folders.splice(0)) await rm(folder, { recursive: true, force: true });
});
async function emptyFolder(): Promise<string> {
  const folder = await mkdtemp(path.join(os.tmpdir(), 'tallyline-demo-'));
  folders.push(folder);
  return folder;
}

describe('seedDemo', () => {
  it('creates the sources, plans and runs it reports, every name labelled as invented', async () => {
    const data = await emptyFolder();
    const report = await seedDemo(data, { start: new Date('2026-03-02T00:00:00Z') });

    expect(await new SettingsRepository(data).get()).toMatchObject({ organisationName: DEMO_ORGANISATION, confidenceLevel: 0.9 });
    const sources = await new SourceRepository(data).list();
    expect(sources.map((source) => source.name).sort()).toEqual(demoSources.map((source) => source.name).sort());
    for (const source of sources) expect(source.name).toMatch(/\(invented\)$/);
    expect(sources.find((source) => source.name.startsWith('Kestrel'))?.parts[0]).toEqual({ name: 'M6 flange nut', characteristics: ['thread gauge', 'flange flatness'] });

    const plans = await new PlanRepository(data).listLatest();
    expect(plans).toHaveLength(demoPlans.length);
    expect(plans.find((plan) => plan.part === 'housing clip')).toMatchObject({ characteristic: 'flash' });

    const runs = await createRunCatalogue(data).listRuns();
    expect(runs).toHaveLength(demoLots.length);
    expect(runs.map((run) => run.runId).sort()).toEqual(report.runs.map((run) => run.id).sort());
    expect(runs.every((run) => run.damage === null)).toBe(true);
    for (const run of runs) expect((await verifyJournal(layout.runJournal(data, run.runId))).ok).toBe(true);

    // Several decided both ways and exactly one unfinished, as the scenario promises.
    expect(runs.filter((run) => run.outcome === 'accepted').length).toBeGreaterThanOrEqual(3);
    expect(runs.filter((run) => run.outcome === 'rejected').length).toBeGreaterThanOrEqual(2);
    expect(runs.filter((run) => run.outcome === 'open')).toHaveLength(1);
    expect(runs.find((run) => run.outcome === 'open')).toMatchObject({ lot: 'BW-0422' });
    // Across weeks: the first and last runs start more than four weeks apart.
    const starts = runs.map((run) => Date.parse(run.startedAt ?? '')).sort();
    expect(starts.at(-1)! - starts[0]).toBeGreaterThan(28 * 86_400_000);
  });

  it('gives the same runs for the same seed', async () => {
    const start = new Date('2026-03-02T00:00:00Z');
    const strip = (report: Awaited<ReturnType<typeof seedDemo>>) => report.runs.map(({ lot, decision, items, nonconforming }) => ({ lot, decision, items, nonconforming }));
    expect(strip(await seedDemo(await emptyFolder(), { start, seed: 7 }))).toEqual(strip(await seedDemo(await emptyFolder(), { start, seed: 7 })));
  });

  it('refuses a folder that already holds Tallyline data and leaves it as it was', async () => {
    const data = await emptyFolder();
    await new SourceRepository(data).create({ name: 'A real supplier' });
    const before = await readdir(path.join(data, 'sources'));
    await expect(seedDemo(data)).rejects.toThrow(DataFolderNotEmptyError);
    await expect(seedDemo(data)).rejects.toThrow(/already holds Tallyline data \(1 source\).*only an empty folder/);
    expect(await readdir(path.join(data, 'sources'))).toEqual(before);
    expect(await readdir(data)).toEqual(['sources']);
  });

  it('fills a folder that holds only files that are not Tallyline data', async () => {
    const data = await emptyFolder();
    await writeFile(path.join(data, 'notes.txt'), 'mine');
    await mkdir(path.join(data, 'runs'));
    await expect(seedDemo(data, { start: new Date('2026-03-02T00:00:00Z') })).resolves.toMatchObject({ sources: expect.any(Array) });
  });
});
