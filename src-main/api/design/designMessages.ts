/** The messages between the design runner and its worker thread: plain data, structured-clonable. */
import type { DesignOptions, PlanDesign, PlanSpec } from '../../engine/index.js';

export interface DesignRequest {
  readonly id: number;
  readonly spec: PlanSpec;
  readonly options: DesignOptions;
}

/** The design, or the engine's refusal (rebuilt as a PlanParameterError), or any other failure. */
export type DesignReply =
  | { readonly id: number; readonly design: PlanDesign }
  | { readonly id: number; readonly planParameter: { parameter: string; value: unknown; allowed: string; message: string } }
  | { readonly id: number; readonly failure: { name: string; message: string } };
