/**
 * Saved plans as the Plan place sees them: the sources to file under, the saved plans, the plan
 * the form came from and its versions. Every change goes through the plan channels.
 */
import type { SavedPlan, SourceChoice } from '../../../../src-main/api/channels/planChannels';
import type { PlanSpec } from '../../../../src-main/engine/index';
import { request } from '../../lib/channelClient';

export type SourceKind = SourceChoice['kind'];
export type SourceTarget = { id: string } | { name: string; kind: SourceKind } | null;

export class PlanLibrary {
  sources = $state.raw<SourceChoice[]>([]);
  plans = $state.raw<SavedPlan[]>([]);
  /** The saved version the form was loaded from or last saved as. */
  current = $state.raw<SavedPlan | null>(null);
  versions = $state.raw<SavedPlan[]>([]);
  problem = $state<string | null>(null);

  async refresh(): Promise<void> {
    const [sources, plans] = await Promise.all([request('plan.sources', null), request('plan.list', null)]);
    if (sources.ok) this.sources = sources.value;
    if (plans.ok) this.plans = plans.value;
    const failed = [sources, plans].find((result) => !result.ok);
    this.problem = failed && !failed.ok ? failed.message : null;
  }

  /** Saves the spec: as the next version of the current plan, or (asNew) as a new plan. */
  async save(input: {
    name: string;
    source: SourceTarget;
    part?: string | null;
    characteristic?: string | null;
    spec: PlanSpec;
    asNew: boolean;
  }): Promise<SavedPlan | null> {
    const id = input.asNew ? undefined : this.current?.id;
    const { name, source, part, characteristic, spec } = input;
    const result = await request('plan.save', { id, name, source, part, characteristic, spec });
    if (!result.ok) {
      this.problem = result.message;
      return null;
    }
    this.problem = null;
    await this.show(result.value);
    return result.value;
  }

  /** Opens one saved version (the latest when no version is given). */
  async open(id: string, version?: number): Promise<SavedPlan | null> {
    const result = await request('plan.open', { id, version });
    if (!result.ok) {
      this.problem = result.message;
      return null;
    }
    this.problem = null;
    await this.show(result.value);
    return result.value;
  }

  /** Forgets which saved plan the form belongs to (after an import, the form is a new plan). */
  detach(): void {
    this.current = null;
    this.versions = [];
  }

  private async show(plan: SavedPlan): Promise<void> {
    this.current = plan;
    const versions = await request('plan.versions', { id: plan.id });
    this.versions = versions.ok ? versions.value : [];
    await this.refresh();
  }
}

/** Whether two specs describe the same plan (the form against a saved version). */
export function sameSpec(a: PlanSpec | null, b: PlanSpec | null): boolean {
  if (a === null || b === null) return a === b;
  // Defaults written out, so a saved version and the form compare equal whether or not they spell them.
  const key = (spec: PlanSpec) => {
    const filled: Record<string, unknown> = { ...spec };
    filled.truncation ??= null;
    if (spec.model === 'passfail' || spec.model === 'count') filled.fit ??= 'wald';
    if (spec.model === 'measurement') filled.overshootCorrection ??= false;
    if (spec.model === 'lifetime') {
      filled.maxTime ??= null;
      filled.maxFailures ??= null;
    }
    return JSON.stringify(Object.keys(filled).sort().map((name) => [name, filled[name]]));
  };
  return key(a) === key(b);
}
