/**
 * What a decision record prints of a plan, in its model's natural units. Each model writes its own
 * lines (`recordLines` of the SequentialModel contract); the record (src-main/record) lays them out
 * and draws the chart without asking which model it is.
 */
import type { ModelShapes } from './sequentialModel.js';

/** One label/value row of a record section; the value may hold line breaks. */
export type RecordRow = readonly [label: string, text: string];

/** One hypothesis: the quality level with its symbol and unit, e.g. p0 = 0.01 fraction nonconforming. */
export interface RecordQuality {
  readonly symbol: string;
  readonly value: number;
  readonly unit: string;
}

/** The plan section after the nominal risks: hypotheses, exact risks, and rows of lines, truncation and expected run. */
export interface RecordPlanLines {
  readonly acceptableQuality: RecordQuality;
  readonly rejectableQuality: RecordQuality;
  /** Exact risks of the plan as run (with its truncation); null when not computed. */
  readonly producerRiskExact: number | null;
  readonly consumerRiskExact: number | null;
  /** Boundaries, truncation, expected run (and what else the model states), in its natural units. */
  readonly rows: RecordRow[];
}

/** The evidence as the decision section and the decision box state it. */
export interface RecordEvidenceLines {
  /** Rows of the decision section, e.g. Items inspected and Nonconforming found. */
  readonly rows: RecordRow[];
  /** One line of counts under the decision headline. */
  readonly facts: string;
}

/** A quality estimate with its interval, labelled with its method. */
export interface RecordEstimate {
  /** Name of the method, printed beside the numbers (say if it ignores the stopping rule). */
  methodName: string;
  pointEstimate: number;
  /** What the point estimate is, printed before it, e.g. "bias-adjusted"; omitted for a plain d/n. */
  pointEstimateName?: string;
  /** The naive d/n, printed for comparison when the point estimate is another one. */
  naiveEstimate?: number;
  confidenceLevel: number;
  lower: number;
  /** Infinite only where the interval has no upper limit (an MTBF with no failure yet). */
  upper: number;
  /** The unit of the estimate, e.g. "fraction nonconforming". */
  unit: string;
  /** A further line, e.g. the share of each class of a graded run. */
  detail?: string;
}

/** A point of the evidence chart, in the chart's units. */
export type ChartPoint = readonly [x: number, y: number];

/** A point of a run's evidence path: entries counted, the running total, the LLR, and for lifetime the test time. */
export interface RecordPathPoint {
  readonly n: number;
  readonly total: number;
  readonly llr: number;
  readonly time?: number;
}

/**
 * The evidence chart in the model's natural units, ready to draw: the run's path and the plan's
 * acceptance and rejection limits.
 */
export interface RecordChart {
  readonly xTitle: string;
  readonly yTitle: string;
  readonly evidenceLabel: string;
  readonly acceptLabel: string;
  readonly rejectLabel: string;
  /** 'steps': whole-number limits, each held flat until the next point; 'line': points joined straight. */
  readonly limitStyle: 'steps' | 'line';
  /** Limit points in x order; null breaks the line (no limit there yet). */
  readonly accept: ReadonlyArray<ChartPoint | null>;
  readonly reject: ReadonlyArray<ChartPoint | null>;
  /** 'steps': x runs flat at the last y, then y steps up (counts per item, failures over time); 'line': points joined straight. */
  readonly pathStyle: 'steps' | 'line';
  /** The run from its start (the first point) to its last counted entry. */
  readonly path: readonly ChartPoint[];
  /** The figure's text alternative. */
  readonly alt: string;
}

/** The shapes of one model the record lines speak about. */
export type RecordShapes = Pick<ModelShapes, 'design' | 'state' | 'observation' | 'row'>;

/** A plan's record lines: what its decision record says, in the model's words and units. */
export interface RecordLines<T extends RecordShapes> {
  /** The model as the record names it, e.g. "passfail (each item conforming or nonconforming; binomial SPRT)". */
  readonly modelLine: string;
  /** The plan section from the plan's design. */
  plan(design: T['design']): RecordPlanLines;
  /** The decision section's rows and the decision box's line of counts. */
  evidence(state: T['state']): RecordEvidenceLines;
  /** One result as the entries table and the CSV print it. */
  resultText(observation: T['observation']): string;
  /**
   * The quality estimate on the evidence, or null before any entry; `decided` says whether a
   * decision stands (a model with a sequential estimate gives it only then).
   */
  estimate(state: T['state'], decided: boolean, confidenceLevel: number): RecordEstimate | null;
  /** The evidence chart from the limits drawn (the run's picture frame) and the run's path. */
  chart(limits: readonly T['row'][], path: readonly RecordPathPoint[]): RecordChart;
}

/** Said on every naive estimate of a model without a sequential one. */
export const SEQUENTIAL_INTERVAL_NOTE =
  'The sequential-exact interval and bias-adjusted estimate are made for pass/fail and count plans only; this naive figure ignores the stopping rule (a sequential stop biases it).';
