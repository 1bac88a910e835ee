import { fitExactRisks } from './exactFit.js';
import type { ExactFit } from './exactFit.js';
import type { IntegerLines } from './integerLines.js';
import type { LinearCountDefinition } from './models/linearCountDefinition.js';
import { validatedDefinition } from './models/linearCountDefinitions.js';
import type { LinearCountSpec } from './spec.js';
import { waldLimits } from './waldBoundaries.js';

/** A validated plan: its model, Wald's limits, and the integer lines actually used. */
export interface ResolvedPlan {
  spec: LinearCountSpec;
  model: LinearCountDefinition<LinearCountSpec>;
  lnA: number;
  lnB: number;
  countWeight: number;
  itemOffset: number;
  /** Wald's lines, before any fit. */
  waldLines: IntegerLines;
  /** The lines in use: Wald's, or the exact-risk fit when spec.fit is 'exact'. */
  lines: IntegerLines;
  fit: ExactFit | null;
}

const fitCache = new Map<string, ExactFit>();
const FIT_CACHE_SIZE = 64;

/**
 * Validates a spec once and resolves the lines it uses. The exact-risk fit is memoised per spec
 * because the live state asks for it on every entry.
 *
 * Method: Wald lines as in waldBoundaries; fit as in fitExactRisks.
 * References: Wald, A. (1947), Sequential Analysis, ch. 3.
 */
export function resolvePlan(spec: LinearCountSpec): ResolvedPlan {
  const model = validatedDefinition(spec);
  const { lnA, lnB } = waldLimits(spec.alpha, spec.beta);
  const { countWeight, itemOffset } = model.linearStatistic(spec);
  const truncation = spec.truncation ?? null;
  const waldLines: IntegerLines = { h1: -lnB / countWeight, h2: lnA / countWeight, slope: itemOffset / countWeight, truncation };
  let fit: ExactFit | null = null;
  if (spec.fit === 'exact') {
    const key = JSON.stringify([spec.model, model.hypotheses(spec), spec.alpha, spec.beta, truncation]);
    fit = fitCache.get(key) ?? null;
    if (fit === null) {
      fit = fitExactRisks(waldLines, model.countStep, model.hypotheses(spec), spec);
      if (fitCache.size >= FIT_CACHE_SIZE) fitCache.delete(fitCache.keys().next().value as string);
      fitCache.set(key, fit);
    }
  }
  const lines = fit === null ? waldLines : { ...waldLines, h1: fit.h1, h2: fit.h2 };
  return { spec, model, lnA, lnB, countWeight, itemOffset, waldLines, lines, fit };
}
