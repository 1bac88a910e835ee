import type { KlDivergences } from './models/linearCountDefinition.js';
import type { FitMode, LinearCountSpec } from './spec.js';
import type { WaldBoundaries } from './waldBoundaries.js';

export interface SampleSizeQuantiles {
  /** Smallest item count by which the decision is made with probability >= 50% (null if never). */
  p50: number | null;
  p90: number | null;
  p99: number | null;
}

export interface CurvePoint {
  /** The quality: p for pass/fail, lambda for count. */
  theta: number;
  ocWald: number;
  asnWald: number;
  ocExact: number;
  asnExact: number;
}

export interface LimitRow {
  n: number;
  /** Acceptance number, null where no acceptance is possible yet. */
  accept: number | null;
  /** Rejection number. */
  reject: number;
}

/** Everything the Plan screen and `tallyline plan --json` show. The first keys are the CLI contract. */
export interface LinearCountDesign {
  /** The lines in use (the fitted ones when fit = 'exact'; ln A and ln B then follow the fitted lines). */
  boundaries: WaldBoundaries;
  kl: KlDivergences;
  wald: { asnH0: number; asnH1: number; asnMax: number };
  exact: {
    alpha: number;
    beta: number;
    asnH0: number;
    asnH1: number;
    /** Largest probability left undecided at H0 or H1 when the recursion stopped (untruncated plans). */
    undecided: number;
    quantilesH0: SampleSizeQuantiles;
    quantilesH1: SampleSizeQuantiles;
  };
  /** The smallest single sampling plan meeting both OC points; null if none up to 10^6 items. */
  single: { n: number; c: number; acceptH0: number; acceptH1: number } | null;
  limits: LimitRow[];
  curve: CurvePoint[];
  // Extras beyond the CLI contract.
  model: LinearCountSpec['model'];
  /** Name of the quality parameter: "p" or "lambda". */
  quality: string;
  hypotheses: { theta0: number; theta1: number };
  risks: { alpha: number; beta: number };
  truncation: number | null;
  /** The truncation rule in words. */
  truncationRule: string;
  /** Smallest n_t whose exact risks are within 10% of nominal (on the lines in use). */
  suggestedTruncation: number | null;
  /** NIST's rule of thumb: three times the single plan's n. */
  threeTimesSingle: number | null;
  /** Expected saving of items against the single plan: 1 - exact ASN / n, at H0 and H1. */
  saving: { h0: number; h1: number } | null;
  /** The lines' intercepts before and after the exact-risk fit; feasible false when no fit meets both risks. */
  fit: { mode: FitMode; waldH1: number; waldH2: number; h1: number; h2: number; feasible: boolean };
  /** Wald's OC and ASN at the quality where E[z] = 0, where Wald's ASN peaks. */
  neutral: { theta: number; ocWald: number; asnWald: number };
  /** P(decision at item count n) for n = 0..length-1, at H0 and H1, for charts. */
  sampleSizeDistribution: { h0: number[]; h1: number[] };
}
