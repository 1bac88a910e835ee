import { describe, expect, it } from 'vitest';
import { readFile, writeFile } from 'node:fs/promises';
import { PlanRepository, SettingsRepository, SourceRepository, StoreFileError, layout } from '../../src-main/store/index.js';
import { tempFolder } from './helpers.js';

const spec = { model: 'passfail', p0: 0.01, p1: 0.05, alpha: 0.05, beta: 0.1 } as const;

describe('the source register', () => {
  it('creates, renames and retires a source, keeping its file for the runs that refer to it', async () => {
    const sources = new SourceRepository(await tempFolder());
    const made = await sources.create({ name: 'Acme Castings', parts: [{ name: 'Housing', characteristics: ['bore'] }] });
    expect((await sources.rename(made.id, 'Acme Foundry')).name).toBe('Acme Foundry');
    await sources.retire(made.id);
    expect(await sources.list()).toEqual([]);
    expect(await sources.get(made.id)).toMatchObject({ name: 'Acme Foundry', retired: true, parts: [{ name: 'Housing' }] });
  });

  it('refuses a second active source with the same name, whatever its case', async () => {
    const sources = new SourceRepository(await tempFolder());
    await sources.create({ name: 'Line 3' });
    await expect(sources.create({ name: 'line 3' })).rejects.toThrow(/already exists/);
  });

  it('finds an existing source by name before creating one', async () => {
    const sources = new SourceRepository(await tempFolder());
    const first = await sources.findOrCreate('Press 7');
    const second = await sources.findOrCreate('press 7');
    expect([first.created, second.created]).toEqual([true, false]);
    expect(second.source.id).toBe(first.source.id);
  });
});

describe('saved plans', () => {
  it('writes tallyline.plan/1 files and saves an edit as the next version, leaving the old one byte for byte', async () => {
    const data = await tempFolder();
    const plans = new PlanRepository(data);
    const first = await plans.save({ name: 'Incoming housings', spec });
    const before = await readFile(layout.planVersionFile(data, first.id, 1), 'utf8');
    const second = await plans.save({ id: first.id, name: 'Incoming housings', spec: { ...spec, p1: 0.04 } });
    expect(JSON.parse(before)).toMatchObject({ format: 'tallyline.plan/1', version: 1, spec });
    expect(second.version).toBe(2);
    expect(await readFile(layout.planVersionFile(data, first.id, 1), 'utf8')).toBe(before);
    expect((await plans.get(first.id)).version).toBe(2);
    expect((await plans.get(first.id, 1)).spec).toEqual(spec);
  });

  it('gives concurrent saves of one plan distinct versions instead of overwriting each other', async () => {
    const plans = new PlanRepository(await tempFolder());
    const first = await plans.save({ name: 'P', spec });
    const saved = await Promise.all([1, 2, 3].map(() => plans.save({ id: first.id, name: 'P', spec })));
    expect(saved.map((plan) => plan.version).sort()).toEqual([2, 3, 4]);
  });

  it('refuses a plan spec whose risks are out of range before writing anything', async () => {
    const plans = new PlanRepository(await tempFolder());
    await expect(plans.save({ name: 'bad', spec: { ...spec, alpha: 1.5 } })).rejects.toThrow(/alpha/);
  });

  it('names the file and the field when a plan file on disk is bad', async () => {
    const data = await tempFolder();
    const plans = new PlanRepository(data);
    const plan = await plans.save({ name: 'P', spec });
    const file = layout.planVersionFile(data, plan.id, 1);
    await writeFile(file, JSON.stringify({ ...plan, spec: { ...spec, beta: 'high' } }));
    const failure = await plans.get(plan.id).catch((error: unknown) => error);
    expect(failure).toBeInstanceOf(StoreFileError);
    expect((failure as Error).message).toContain(file);
    expect((failure as Error).message).toContain('spec.beta');
  });

  it('refuses an id that would leave the plans folder', async () => {
    const plans = new PlanRepository(await tempFolder());
    await expect(plans.get('../settings')).rejects.toThrow(/not allowed/);
  });
});

describe('settings', () => {
  it('gives defaults before anything is saved and keeps what was saved', async () => {
    const data = await tempFolder();
    const settings = new SettingsRepository(data);
    expect(await settings.get()).toMatchObject({ confidenceLevel: 0.9, theme: 'system' });
    await settings.update({ organisationName: 'Northwind', theme: 'dark' });
    expect(await new SettingsRepository(data).get()).toMatchObject({ organisationName: 'Northwind', theme: 'dark', site: '' });
  });

  it('refuses a confidence level outside (0.5, 1)', async () => {
    const settings = new SettingsRepository(await tempFolder());
    await expect(settings.update({ confidenceLevel: 1.2 })).rejects.toThrow(/confidenceLevel/);
  });
});
