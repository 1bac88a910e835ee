import { checkPlanSpec, isLinearCountSpec, klDivergences, waldBoundaries, type PlanDesign, type PlanSpec } from '../../engine/index.js';
import { PLAN_FORMAT, PlanRepository, planVersionSchema, type PlanVersion } from '../../store/plans.js';
import { SourceRepository } from '../../store/sources.js';
import type { DesignAnswer, SavedPlan } from '../channels/planChannels.js';
import { createDesignRunner, SUPERSEDED, type DesignRunner } from '../design/designRunner.js';
import type { ChannelHandlers } from '../dispatcher.js';
import { ChannelFailure } from '../result.js';

type PlanHandlers = Pick<
  ChannelHandlers,
  'plan.limits' | 'plan.design' | 'plan.sources' | 'plan.save' | 'plan.list' | 'plan.versions' | 'plan.open' | 'plan.export' | 'plan.import'
>;

export interface PlanHandlerContext {
  dataDirectory: string;
  /** Where designs run (a worker thread in the built app); one is made when not given. */
  designRunner?: DesignRunner;
}

/** Designs kept for quick return to a recent input (typing a digit and deleting it again). */
const designCacheSize = 24;

export function createPlanHandlers(context: PlanHandlerContext): PlanHandlers {
  const plans = new PlanRepository(context.dataDirectory);
  const sources = new SourceRepository(context.dataDirectory);
  const latest = new LatestTicket();
  const recentDesigns = new Map<string, PlanDesign>();
  const runner = context.designRunner ?? createDesignRunner();

  /** A design from the recent ones, or from the runner (off the request path); SUPERSEDED when a newer edit of the stream came. */
  async function designOnce(spec: PlanSpec, curvePoints: number | undefined, stream: string | undefined): Promise<PlanDesign | typeof SUPERSEDED> {
    const key = JSON.stringify([spec, curvePoints ?? null]);
    const known = recentDesigns.get(key);
    if (known) return known;
    // The engine's one check first, on this thread: a refused spec answers at once, without a worker.
    checkPlanSpec(spec, { curvePoints });
    const design = await runner.design(spec, { curvePoints }, stream);
    if (design === SUPERSEDED) return design;
    recentDesigns.set(key, design);
    if (recentDesigns.size > designCacheSize) recentDesigns.delete(recentDesigns.keys().next().value as string);
    return design;
  }

  async function withSourceName(plan: PlanVersion): Promise<SavedPlan> {
    if (plan.sourceId === null) return { ...plan, sourceName: null };
    const source = await sources.get(plan.sourceId).catch(() => undefined);
    return { ...plan, sourceName: source?.name ?? null };
  }

  async function existingPlan(id: string, version?: number): Promise<PlanVersion> {
    const versions = await plans.versions(id).catch((): number[] => []);
    if (versions.length === 0) throw new ChannelFailure('not-found', `There is no saved plan with id ${id}.`, 'id');
    if (version !== undefined && !versions.includes(version)) {
      throw new ChannelFailure('not-found', `Plan ${id} has no version ${version}; it has ${versions.map((v) => `v${v}`).join(', ')}.`, 'version');
    }
    return plans.get(id, version);
  }

  return {
    'plan.limits': (spec) => ({ boundaries: waldBoundaries(spec), kl: klDivergences(spec) }),

    'plan.design': async ({ spec, suggestTruncation, curvePoints, stream, ticket }): Promise<DesignAnswer> => {
      if (stream !== undefined && ticket !== undefined) {
        if (!(await latest.isStillNewest(stream, ticket))) return { superseded: true };
      }
      // Only the linear-count designs suggest a truncation; the other models are designed as given.
      if (!suggestTruncation || !isLinearCountSpec(spec)) {
        const design = await designOnce(spec, curvePoints, stream);
        return design === SUPERSEDED ? { superseded: true } : { superseded: false, spec, design };
      }
      // The suggestion is computed on the untruncated lines; the plan then stops there.
      const untruncated = await designOnce({ ...spec, truncation: null }, curvePoints, stream);
      if (untruncated === SUPERSEDED) return { superseded: true };
      const truncated = { ...spec, truncation: 'suggestedTruncation' in untruncated ? untruncated.suggestedTruncation : null };
      const design = await designOnce(truncated, curvePoints, stream);
      return design === SUPERSEDED ? { superseded: true } : { superseded: false, spec: truncated, design };
    },

    'plan.sources': async () =>
      (await sources.list()).map((source) => ({ id: source.id, name: source.name, kind: source.kind, parts: source.parts })),

    'plan.save': async ({ id, name, source, part, characteristic, spec }) => {
      checkPlanSpec(spec); // refuses an invalid spec with the engine's own message before anything is written
      if (id !== undefined) await existingPlan(id);
      let sourceId: string | null = null;
      if (source !== null && 'id' in source) {
        sourceId = (await sources.get(source.id).catch(() => {
          throw new ChannelFailure('not-found', `There is no source with id ${source.id}.`, 'source');
        })).id;
      } else if (source !== null) {
        const found = await sources.findByName(source.name);
        sourceId = (found ?? (await sources.create({ name: source.name, kind: source.kind }))).id;
      }
      if ((part || characteristic) && sourceId === null) {
        throw new ChannelFailure('invalid-payload', 'A part or characteristic belongs to a source: choose the source first.', 'part');
      }
      return withSourceName(await plans.save({ id, name, sourceId, part, characteristic, spec }));
    },

    'plan.list': async () => {
      const latestVersions = await plans.listLatest();
      latestVersions.sort((a, b) => b.createdAt.localeCompare(a.createdAt));
      return Promise.all(latestVersions.map(withSourceName));
    },

    'plan.versions': async ({ id }) => {
      await existingPlan(id);
      const numbers = await plans.versions(id);
      return Promise.all(numbers.map(async (version) => withSourceName(await plans.get(id, version))));
    },

    'plan.open': async ({ id, version }) => withSourceName(await existingPlan(id, version)),

    'plan.export': async ({ id, version }) => {
      const plan = await existingPlan(id, version);
      const slug = plan.name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'plan';
      return { fileName: `${slug}-v${plan.version}.tallyline-plan.json`, text: JSON.stringify(plan, null, 2) + '\n' };
    },

    'plan.import': async ({ text }) => {
      const plan = parsePlanFile(text);
      const source = plan.sourceId === null ? undefined : await sources.get(plan.sourceId).catch(() => undefined);
      return {
        name: plan.name,
        spec: plan.spec,
        origin: { id: plan.id, version: plan.version, sourceId: source?.id ?? null, sourceName: source?.name ?? null },
      };
    },
  };
}

/** Reads a plan file, saying exactly what is wrong with one that is not a valid `tallyline.plan/1`. */
export function parsePlanFile(text: string): PlanVersion {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    throw new ChannelFailure('invalid-payload', `This file is not JSON (${(error as Error).message}), so it is not a Tallyline plan file.`, 'file');
  }
  const format = typeof value === 'object' && value !== null ? (value as { format?: unknown }).format : undefined;
  if (format !== PLAN_FORMAT) {
    const found = format === undefined ? 'has no "format" field' : `has "format": ${JSON.stringify(format)}`;
    throw new ChannelFailure('invalid-payload', `This file ${found}; a Tallyline plan file has "format": "${PLAN_FORMAT}".`, 'file');
  }
  const parsed = planVersionSchema.safeParse(value);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const where = issue?.path.join('.') || 'the file';
    throw new ChannelFailure('invalid-payload', `The plan file is not valid at "${where}": ${issue?.message ?? 'invalid'}.`, 'file');
  }
  return parsed.data as PlanVersion;
}

/**
 * Main-side supersession of requests that a user fires while typing: each stream (one per open
 * screen) numbers its requests; a request whose turn comes after a newer one of the same stream
 * arrived is dropped without computing.
 */
class LatestTicket {
  private readonly newest = new Map<string, number>();

  constructor(private readonly maximumStreams = 64) {}

  /**
   * Records the ticket, lets requests already waiting in the event loop arrive, then answers
   * whether this ticket is still the newest of its stream.
   */
  async isStillNewest(stream: string, ticket: number): Promise<boolean> {
    const known = this.newest.get(stream);
    if (known === undefined || ticket > known) this.remember(stream, ticket);
    await new Promise((resolve) => setImmediate(resolve));
    return this.newest.get(stream) === ticket;
  }

  private remember(stream: string, ticket: number): void {
    this.newest.delete(stream);
    this.newest.set(stream, ticket);
    if (this.newest.size > this.maximumStreams) this.newest.delete(this.newest.keys().next().value as string);
  }
}
