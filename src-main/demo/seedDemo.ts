/**
 * Fills an empty data folder with the invented demo scenario (demoScenario.ts), made through the
 * real repositories and run service, with results drawn from a seeded random stream so the same
 * seed gives the same runs.
 */
import { readdir } from 'node:fs/promises';
import path from 'node:path';
import { planOf, type PlanSpec, type SequentialPlan } from '../engine/index.js';
import { seededUniform32 } from '../engine/numerics/seededRandom.js';
import { createRunService } from '../inspection/index.js';
import { PlanRepository, SettingsRepository, SourceRepository, folderNames } from '../store/index.js';
import { DEMO_INSPECTORS, DEMO_ORGANISATION, DEMO_SITE, demoLots, demoPlans, demoSources } from './demoScenario.js';

export interface DemoReport {
  readonly dataDirectory: string;
  readonly sources: { id: string; name: string }[];
  readonly plans: { id: string; name: string }[];
  readonly runs: { id: string; lot: string; source: string; decision: 'accept' | 'reject' | 'continue'; items: number; nonconforming: number }[];
}

export interface DemoOptions {
  /** Seed of the random results; the default gives the runs described in the README. */
  readonly seed?: number;
  /** The scenario's first day (midnight UTC); by default five weeks before today. */
  readonly start?: Date;
}

/** The folder already holds Tallyline data: the demo never mixes with real records. */
export class DataFolderNotEmptyError extends Error {
  readonly code = 'DATA_FOLDER_NOT_EMPTY';
  constructor(readonly dataDirectory: string, found: string) {
    super(`${dataDirectory} already holds Tallyline data (${found}); the demo fills only an empty folder. Choose another with --data-dir.`);
    this.name = 'DataFolderNotEmptyError';
  }
}

const SECONDS_PER_ITEM = 40;
const SHIFT_START_HOUR = 7;

/** What of Tallyline's data the folder holds, or null when none. */
export async function dataFolderContents(dataDirectory: string): Promise<string | null> {
  const top = await folderNames(dataDirectory);
  if (top.includes('settings.json')) return 'settings.json';
  for (const [folder, what] of [['sources', 'sources'], ['plans', 'plans'], ['runs', 'runs']] as const) {
    if (!top.includes(folder)) continue;
    const count = (await readdir(path.join(dataDirectory, folder))).filter((name) => !name.startsWith('.')).length;
    if (count > 0) return `${count} ${count === 1 ? what.slice(0, -1) : what}`;
  }
  return null;
}

export async function seedDemo(dataDirectory: string, options: DemoOptions = {}): Promise<DemoReport> {
  const found = await dataFolderContents(dataDirectory);
  if (found !== null) throw new DataFolderNotEmptyError(dataDirectory, found);
  const random = seededUniform32(options.seed ?? 20261201);
  const today = new Date();
  const start = options.start ?? new Date(Date.UTC(today.getUTCFullYear(), today.getUTCMonth(), today.getUTCDate() - 35));
  let now = new Date(start.getTime() - 86_400_000);
  const clock = () => new Date(now);

  await new SettingsRepository(dataDirectory).update({ organisationName: DEMO_ORGANISATION, site: DEMO_SITE, confidenceLevel: 0.9 });
  const sourceRepository = new SourceRepository(dataDirectory, clock);
  const planRepository = new PlanRepository(dataDirectory, clock);
  const sourceIds = new Map<string, string>();
  const report: DemoReport = { dataDirectory, sources: [], plans: [], runs: [] };
  for (const demo of demoSources) {
    const source = await sourceRepository.create({ name: demo.name, kind: demo.kind, parts: demo.parts });
    sourceIds.set(demo.key, source.id);
    report.sources.push({ id: source.id, name: source.name });
  }
  const plans = new Map<string, { id: string; sourceId: string; sequential: SequentialPlan }>();
  for (const demo of demoPlans) {
    const sourceId = sourceIds.get(demo.sourceKey) as string;
    const plan = await planRepository.save({ name: demo.name, sourceId, part: demo.part, characteristic: demo.characteristic, spec: demo.spec });
    plans.set(demo.key, { id: plan.id, sourceId, sequential: planOf<PlanSpec>(demo.spec) });
    report.plans.push({ id: plan.id, name: plan.name });
  }

  const service = createRunService({ dataDirectory, clock });
  try {
    for (const [index, lot] of demoLots.entries()) {
      const plan = plans.get(lot.planKey) as { id: string; sourceId: string; sequential: SequentialPlan };
      now = new Date(start.getTime() + (lot.day * 24 + SHIFT_START_HOUR) * 3_600_000 + index * 97_000);
      const inspector = DEMO_INSPECTORS[index % DEMO_INSPECTORS.length];
      const view = await service.startRun({ planId: plan.id, sourceId: plan.sourceId, lot: lot.lot, lotSize: lot.lotSize, inspector });
      let state = view.state;
      let drawn = plan.sequential.emptyEvidence();
      for (let item = 1; state.decision === 'continue' && item <= (lot.stopAfter ?? Number.MAX_SAFE_INTEGER); item += 1) {
        now = new Date(now.getTime() + SECONDS_PER_ITEM * 1000);
        // Drawn at the lot's true quality by the plan's model; the evidence so far is kept only for the draw (a lifetime failure comes after the test time so far).
        const result = plan.sequential.drawObservation(drawn, lot.trueQuality, random);
        drawn = plan.sequential.observe(drawn, result);
        const itemId = `${lot.lot}-${String(item).padStart(3, '0')}`;
        state = (await service.recordResult(view.run.id, { itemId, result, actor: inspector })).state;
      }
      report.runs.push({
        id: view.run.id,
        lot: lot.lot,
        source: view.run.sourceName,
        decision: state.decision,
        items: state.n,
        nonconforming: state.total,
      });
    }
  } finally {
    await service.close();
  }
  return report;
}

/** The report in a few lines for the terminal. */
export function describeDemo(report: DemoReport): string {
  const decided = report.runs.filter((run) => run.decision !== 'continue');
  const count = (decision: string) => decided.filter((run) => run.decision === decision).length;
  return [
    `Filled ${report.dataDirectory} with the invented demo scenario:`,
    `  ${report.sources.length} sources (${report.sources.map((source) => source.name).join(', ')})`,
    `  ${report.plans.length} plans, ${report.runs.length} runs: ${count('accept')} accepted, ${count('reject')} rejected, ${report.runs.length - decided.length} still open`,
    `  organisation "${DEMO_ORGANISATION}", site "${DEMO_SITE}"; every name is invented.`,
    `Open it with: npm start -- --data-dir ${JSON.stringify(report.dataDirectory)}`,
  ].join('\n');
}

