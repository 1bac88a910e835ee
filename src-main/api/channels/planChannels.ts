import { z } from 'zod';
import { idSchema } from '../../store/ids.js';
import { shortText } from '../../store/textFields.js';
import type { PlanDesign, PlanSpec, KlDivergences, WaldBoundaries } from '../../engine/index.js';
import { planSpecSchemas } from '../../store/planSpecSchema.js';
import type { PlanVersion } from '../../store/plans.js';
import type { SourceKind, SourcePart } from '../../store/sources.js';

/** Shape only at the channel: ranges (0 < p0 < p1 < 1, alpha + beta < 1, ...) are the engine factory's job, with its specific messages. */
const channelSpecSchemas = planSpecSchemas({ proportion: z.number().finite(), positive: z.number().finite(), whole: z.number().int() });

/** The linear-count models (pass/fail, count): the only ones `plan.limits` answers for. */
export const linearPlanSpecSchema = channelSpecSchemas.linear;

/** The plan parameters of every model as they cross a channel (IPC, HTTP). */
export const planSpecSchema = channelSpecSchemas.any;

const planId = idSchema('plan');
const nothing = z.null().optional();

/** Largest plan file the import accepts, in characters; real ones are under 1 kB. */
export const maximumPlanFileLength = 100_000;

/** Channels of the Plan place. */
export const planChannels = {
  /** Wald's limits and the evidence per item (KL both ways) of a pass/fail or count plan: cheap, asked on every keystroke. */
  'plan.limits': { input: linearPlanSpecSchema },
  /**
   * The whole design of a plan: limits, Wald and exact risks and ASN, curves, the single sampling
   * plan, the table of acceptance/rejection numbers, the distribution of items inspected.
   * `suggestTruncation` truncates where the engine suggests (the spec's truncation is then ignored);
   * pass/fail and count only, the other models are designed as given.
   * The answer's `design` is discriminated by `model`: LinearCountDesign (passfail, count), MeasurementDesign,
   * LifetimeDesign or GradedDesign (engine/models/*-design.ts).
   * `stream` + `ticket`: a request superseded by a newer ticket of the same stream before its turn
   * answers `{ superseded: true }` without computing.
   */
  'plan.design': {
    input: z.object({
      spec: planSpecSchema,
      suggestTruncation: z.boolean().optional(),
      curvePoints: z.number().int().min(11).max(401).optional(),
      stream: z.string().min(1).max(64).optional(),
      ticket: z.number().int().nonnegative().optional(),
    }),
  },
  /** Active sources to file a plan under. */
  'plan.sources': { input: nothing },
  /** Saves a plan under a source: a new plan (version 1), or with `id` the next version of that plan. */
  'plan.save': {
    input: z.object({
      id: planId.optional(),
      name: shortText('A plan name', 'A plan needs a name.'),
      source: z
        .union([
          z.object({ id: idSchema('source') }),
          z.object({ name: shortText('A source name', 'A source needs a name.'), kind: z.enum(['supplier', 'line', 'machine']) }),
        ])
        .nullable(),
      /** The source's part this plan checks, and its characteristic (a run's record prints both). */
      part: z.string().trim().max(120).nullable().optional(),
      characteristic: z.string().trim().max(120).nullable().optional(),
      spec: planSpecSchema,
    }),
  },
  /** The latest version of every saved plan, newest first. */
  'plan.list': { input: nothing },
  /** Every version of one plan, oldest first. */
  'plan.versions': { input: z.object({ id: planId }) },
  /** One version (the latest when `version` is left out). */
  'plan.open': { input: z.object({ id: planId, version: z.number().int().positive().optional() }) },
  /** The plan file (`"format": "tallyline.plan/1"`) of one version, to download. */
  'plan.export': { input: z.object({ id: planId, version: z.number().int().positive().optional() }) },
  /** Checks a plan file's text and gives back its plan, not yet saved. */
  'plan.import': { input: z.object({ text: z.string().max(maximumPlanFileLength, 'A plan file is at most 100 kB.') }) },
} as const;

/** What `designPlan` computes, as it travels to the renderer: discriminated by `model`. */
export type LinearCountDesign = PlanDesign;

export type DesignAnswer =
  | { superseded: true }
  | { superseded: false; /** the spec that was designed, truncation resolved */ spec: PlanSpec; design: LinearCountDesign };

export interface SourceChoice {
  id: string;
  name: string;
  kind: SourceKind;
  /** The source's parts with their characteristics, for the part and characteristic pickers. */
  parts: SourcePart[];
}

/** A saved plan version with the name of its source, for lists. */
export interface SavedPlan extends PlanVersion {
  sourceName: string | null;
}

export interface PlanChannelOutputs {
  'plan.limits': { boundaries: WaldBoundaries; kl: KlDivergences };
  'plan.design': DesignAnswer;
  'plan.sources': SourceChoice[];
  'plan.save': SavedPlan;
  'plan.list': SavedPlan[];
  'plan.versions': SavedPlan[];
  'plan.open': SavedPlan;
  'plan.export': { fileName: string; text: string };
  'plan.import': { name: string; spec: PlanSpec; origin: { id: string; version: number; sourceId: string | null; sourceName: string | null } };
}
