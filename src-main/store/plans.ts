/**
 * Saved plans, versioned. Each version is its own write-once file: a version that a run uses can
 * never change, because no version ever changes; saving an edit makes the next version.
 */
import { folderNames } from './folderNames.js';
import { z } from 'zod';
import type { PlanSpec } from '../engine/index.js';
import { newId } from './ids.js';
import { readJsonFile, writeJsonFileOnce } from './jsonFile.js';
import { layout } from './layout.js';
import { planSpecSchema } from './planSpecSchema.js';

export const PLAN_FORMAT = 'tallyline.plan/1';

export const planVersionSchema = z.object({
  format: z.literal(PLAN_FORMAT),
  id: z.string().min(1),
  version: z.number().int().positive(),
  name: z.string().min(1),
  sourceId: z.string().nullable(),
  part: z.string().min(1).optional(),
  characteristic: z.string().min(1).optional(),
  spec: planSpecSchema,
  createdAt: z.string(),
});

export interface PlanVersion {
  readonly format: typeof PLAN_FORMAT;
  readonly id: string;
  readonly version: number;
  readonly name: string;
  /** The source this plan was made for, or null for a plan not tied to one. */
  readonly sourceId: string | null;
  /** The part of the source this plan is for, and the characteristic checked (absent when not named). */
  readonly part?: string;
  readonly characteristic?: string;
  readonly spec: PlanSpec;
  readonly createdAt: string;
}

export interface PlanDraft {
  /** Absent for a new plan; present to save the next version of an existing one. */
  readonly id?: string;
  readonly name: string;
  readonly sourceId?: string | null;
  readonly part?: string | null;
  readonly characteristic?: string | null;
  readonly spec: PlanSpec;
}

const VERSION_FILE = /^v(\d+)\.json$/;
const SAVE_ATTEMPTS = 5;

export class PlanRepository {
  constructor(
    private readonly dataDirectory: string,
    private readonly clock: () => Date = () => new Date(),
  ) {}

  /** Save a draft as a new plan (version 1) or as the next version of `draft.id`. */
  async save(draft: PlanDraft): Promise<PlanVersion> {
    const id = draft.id ?? newId('plan', this.clock());
    const spec = planSpecSchema.parse(draft.spec) as PlanSpec;
    for (let attempt = 0; ; attempt += 1) {
      const version = ((await this.versions(id)).at(-1) ?? 0) + 1;
      const plan: PlanVersion = {
        format: PLAN_FORMAT,
        id,
        version,
        name: draft.name.trim() || 'Untitled plan',
        sourceId: draft.sourceId ?? null,
        // Left out rather than null when not named, so files of plans without them stay as they were.
        ...(draft.part?.trim() ? { part: draft.part.trim() } : {}),
        ...(draft.characteristic?.trim() ? { characteristic: draft.characteristic.trim() } : {}),
        spec,
        createdAt: this.clock().toISOString(),
      };
      try {
        await writeJsonFileOnce(layout.planVersionFile(this.dataDirectory, id, version), plan);
        return plan;
      } catch (error) {
        // Another writer took this version number first: take the next one.
        if ((error as NodeJS.ErrnoException).code !== 'EEXIST' || attempt >= SAVE_ATTEMPTS) throw error;
      }
    }
  }

  /** One version, or the latest when `version` is omitted. */
  async get(id: string, version?: number): Promise<PlanVersion> {
    const wanted = version ?? (await this.versions(id)).at(-1);
    if (wanted === undefined) throw new Error(`no plan with id ${JSON.stringify(id)}`);
    const file = layout.planVersionFile(this.dataDirectory, id, wanted);
    const plan = (await readJsonFile(file, planVersionSchema)) as PlanVersion;
    if (plan.id !== id || plan.version !== wanted) {
      throw new Error(`${file}: holds plan ${plan.id} v${plan.version}, expected ${id} v${wanted}`);
    }
    return plan;
  }

  /** The version numbers saved for a plan, ascending (empty when there is no such plan). */
  async versions(id: string): Promise<number[]> {
    const names = await folderNames(layout.planFolder(this.dataDirectory, id));
    return names
      .map((name) => VERSION_FILE.exec(name)?.[1])
      .filter((found): found is string => found !== undefined)
      .map(Number)
      .sort((a, b) => a - b);
  }

  /** The latest version of every plan. */
  async listLatest(): Promise<PlanVersion[]> {
    const ids = await folderNames(layout.plansFolder(this.dataDirectory));
    const plans = await Promise.all(ids.filter((id) => !id.startsWith('.')).map((id) => this.get(id).catch(() => undefined)));
    return plans.filter((plan): plan is PlanVersion => plan !== undefined);
  }
}
