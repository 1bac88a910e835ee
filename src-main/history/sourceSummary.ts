/**
 * The summary of one source's runs: how many were accepted and rejected, items inspected and
 * nonconforming found, the decisions over time, and the pooled fraction with its caveat.
 * Pure: takes the runs as plain data, reads nothing.
 */
import type { PlanSpec, LinearCountSpec } from '../engine/index.js';

/** One run as the summary needs it. */
export interface HistoryRun {
  readonly id: string;
  /** When the run was started (ISO 8601). */
  readonly startedAt: string;
  readonly lot: string;
  readonly planName: string;
  /** From the plan version, when it named them. */
  readonly part: string | null;
  readonly characteristic: string | null;
  readonly model: PlanSpec['model'];
  /** Closed with a decision, or still open (never decided, or reopened by an override). */
  readonly status: 'open' | 'closed';
  readonly decision: 'continue' | 'accept' | 'reject';
  /** Items inspected (voided entries not counted). */
  readonly itemsInspected: number;
  /** Nonconforming items (pass/fail) or nonconformities (count) found; 0 for the other models. */
  readonly nonconformingFound: number;
  /** False when the run's journal does not verify; such a run is counted but flagged. */
  readonly verified: boolean;
}

/** The pooled figure of one data model: sums over the decided runs of that model. */
export interface PooledFigure {
  readonly model: LinearCountSpec['model'];
  readonly runs: number;
  readonly itemsInspected: number;
  readonly nonconformingFound: number;
  /** nonconformingFound / itemsInspected; null when no item was inspected. */
  readonly pooled: number | null;
  /** What the figure is a rate of, for the screen. */
  readonly unit: 'fraction nonconforming' | 'nonconformities per item';
}

/** The decisions over time as running counts, one point per decided run, oldest first. */
export interface DecisionTrend {
  /** Start of each decided run, seconds since 1970 (uPlot's time scale). */
  readonly time: number[];
  readonly acceptedSoFar: number[];
  readonly rejectedSoFar: number[];
}

export interface SourceSummary {
  readonly runs: number;
  readonly accepted: number;
  readonly rejected: number;
  /** Runs without a standing decision. */
  readonly open: number;
  /** Runs whose journal does not verify. */
  readonly unverified: number;
  /** Over every run, decided or not. */
  readonly itemsInspected: number;
  readonly nonconformingFound: number;
  readonly firstRunAt: string | null;
  readonly lastRunAt: string | null;
  /** One figure per data model used, since a fraction and a rate per item cannot be added. */
  readonly pooled: PooledFigure[];
  readonly trend: DecisionTrend;
}

/** Why the pooled figure is not an estimate to act on; the screen shows it beside the figure. */
export const POOLING_CAVEAT =
  'Each run stopped as soon as its evidence crossed a limit, so its count of nonconforming items depends on ' +
  'where it stopped: adding up sequential runs and dividing is biased, by an amount that depends on the plans ' +
  'and the true quality. Read the pooled figure as a rough indication only; the bias-adjusted estimate and ' +
  'exact interval of each decided run are in its decision record.';

const UNITS = { passfail: 'fraction nonconforming', count: 'nonconformities per item' } as const;

function isDecided(run: HistoryRun): run is HistoryRun & { decision: 'accept' | 'reject' } {
  return run.status === 'closed' && run.decision !== 'continue';
}

/**
 * Sums a source's runs. A run counts as accepted or rejected only while it stands closed with that
 * decision; an open run (not yet decided, or reopened after its decision by an override) counts as
 * open. The pooled figure uses decided runs only, per data model.
 */
export function summariseSource(runs: readonly HistoryRun[]): SourceSummary {
  const byStart = [...runs].sort((a, b) => a.startedAt.localeCompare(b.startedAt));
  const decided = byStart.filter(isDecided);
  const accepted = decided.filter((run) => run.decision === 'accept').length;
  const sum = (list: readonly HistoryRun[], key: 'itemsInspected' | 'nonconformingFound') =>
    list.reduce((total, run) => total + run[key], 0);

  // Only fractions and rates per item pool; measurements, test times and grades have no such figure.
  const models = [...new Set(decided.map((run) => run.model))].filter((model): model is LinearCountSpec['model'] => model === 'passfail' || model === 'count').sort();
  const pooled = models.map((model): PooledFigure => {
    const ofModel = decided.filter((run) => run.model === model);
    const itemsInspected = sum(ofModel, 'itemsInspected');
    const nonconformingFound = sum(ofModel, 'nonconformingFound');
    return {
      model,
      runs: ofModel.length,
      itemsInspected,
      nonconformingFound,
      pooled: itemsInspected === 0 ? null : nonconformingFound / itemsInspected,
      unit: UNITS[model],
    };
  });

  const trend: DecisionTrend = { time: [], acceptedSoFar: [], rejectedSoFar: [] };
  let acceptedSoFar = 0;
  let rejectedSoFar = 0;
  for (const run of decided) {
    if (run.decision === 'accept') acceptedSoFar += 1;
    else rejectedSoFar += 1;
    trend.time.push(Date.parse(run.startedAt) / 1000);
    trend.acceptedSoFar.push(acceptedSoFar);
    trend.rejectedSoFar.push(rejectedSoFar);
  }

  return {
    runs: runs.length,
    accepted,
    rejected: decided.length - accepted,
    open: runs.length - decided.length,
    unverified: runs.filter((run) => !run.verified).length,
    itemsInspected: sum(runs, 'itemsInspected'),
    nonconformingFound: sum(runs, 'nonconformingFound'),
    firstRunAt: byStart[0]?.startedAt ?? null,
    lastRunAt: byStart.at(-1)?.startedAt ?? null,
    pooled,
    trend,
  };
}
