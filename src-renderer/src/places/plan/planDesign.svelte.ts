/**
 * The design of the plan on screen, asked of the main side as the engineer types: debounced here,
 * numbered so the main side can drop a request a newer one has overtaken, and only the newest
 * answer is ever shown.
 */
import type { LinearCountDesign } from '../../../../src-main/api/channels/planChannels';
import type { PlanSpec } from '../../../../src-main/engine/index';
import { request } from '../../lib/channelClient';
import { latestOnly } from '../../lib/latestOnly';
import { messageInScreenUnits } from './messageInScreenUnits';
import type { DraftReading } from './planDraft.svelte';

export interface DesignProblem {
  message: string;
  /** Engine parameter or input field the message is about, when known. */
  field?: string;
}

/**
 * Points on the OC and ASN curves. A graded plan's exact recursion runs once per point and takes
 * seconds at 81, so its curves are drawn with fewer points (still smooth over its family).
 */
function curvePointsFor(spec: PlanSpec): number {
  return spec.model === 'graded' ? 31 : 81;
}

type Request = { spec: PlanSpec; suggestTruncation: boolean };

export class PlanDesignState {
  /** The newest design, for `spec`; null while the inputs do not make a plan. */
  design = $state.raw<LinearCountDesign | null>(null);
  /** The spec the design belongs to (truncation resolved when suggested). */
  spec = $state.raw<PlanSpec | null>(null);
  problem = $state.raw<DesignProblem | null>(null);
  /** The problem was found in the form (not by the engine): gone as soon as the form reads as a plan. */
  private problemFromForm = false;
  /** True between a change of the inputs and the answer for it. */
  pending = $state(false);

  private readonly stream = `plan-${Math.random().toString(36).slice(2, 10)}`;
  private ticket = 0;
  /** Bumped when the inputs turn invalid, so an answer still on its way is not shown. */
  private generation = 0;
  private readonly ask = latestOnly(
    async (wanted: Request & { generation: number }) => ({
      generation: wanted.generation,
      model: wanted.spec.model,
      result: await request('plan.design', {
        spec: wanted.spec,
        suggestTruncation: wanted.suggestTruncation,
        curvePoints: curvePointsFor(wanted.spec),
        stream: this.stream,
        ticket: ++this.ticket,
      }),
    }),
    ({ generation, model, result }) => {
      if (generation !== this.generation) return; // the inputs became invalid meanwhile
      if (result.ok && result.value.superseded) return; // a newer request is on its way
      this.pending = false;
      if (result.ok && !result.value.superseded) {
        this.design = result.value.design;
        this.spec = result.value.spec;
        this.problem = null;
      } else if (!result.ok) {
        this.design = null;
        this.spec = null;
        this.problem = { message: messageInScreenUnits(result.message, model), field: result.field };
      }
    },
    150,
  );

  /** Takes the newest reading of the form: asks for its design, or clears figures for invalid input. */
  update(reading: DraftReading): void {
    if (!reading.ok) {
      this.generation += 1;
      this.pending = false;
      this.design = null;
      this.spec = null;
      this.problem = { message: reading.message, field: reading.field };
      this.problemFromForm = true;
      return;
    }
    if (this.problemFromForm) this.problem = null;
    this.problemFromForm = false;
    this.pending = true;
    this.ask({ spec: reading.spec, suggestTruncation: reading.suggestTruncation, generation: this.generation });
  }
}
