/**
 * The summary of one source's runs: how many were accepted and rejected, items inspected and
 * nonconforming found, the decisions over time, and the pooled fraction with its caveat.
 * Pure: takes the runs as plain data, reads nothing.
 */
import { modelLabels, type ModelName } from '../engine/index.js';
import type { RunRow } from '../inspection/runCatalogue.js';

/** One run as the summary needs it: the catalogue's row (inspection/runCatalogue.ts) carries these fields. */
export type SummaryRun = Pick<RunRow, 'runId' | 'outcome' | 'startedAt' | 'model' | 'itemsInspected' | 'nonconformingFound'>;

/** The pooled figure of one data model: sums over the decided runs of that model. */
export interface PooledFigure {
  readonly model: ModelName;
  readonly runs: number;
  readonly itemsInspected: number;
  readonly nonconformingFound: number;
  /** nonconformingFound / itemsInspected; null when no item was inspected. */
  readonly pooled: number | null;
  /** What the figure is a rate of, for the screen (the model's `labels.pooledRate`). */
  readonly unit: string;
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
  /** Runs without a standing decision: open, or reopened after a decision. */
  readonly open: number;
  /** Runs whose journal is damaged (counted with their good entries). */
  readonly damaged: number;
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

function isDecided(run: SummaryRun): boolean {
  return run.outcome === 'accepted' || run.outcome === 'rejected';
}

/**
 * Sums a source's runs. A run counts as accepted or rejected only while that decision stands; an
 * open or reopened run counts as open, a damaged one as damaged. The pooled figure uses decided
 * runs only, per data model.
 */
export function summariseSource(runs: readonly SummaryRun[]): SourceSummary {
  const started = (run: SummaryRun) => (run.startedAt === null ? -Infinity : Date.parse(run.startedAt));
  const byStart = [...runs].sort((a, b) => started(a) - started(b) || 0);
  const decided = byStart.filter(isDecided);
  const accepted = decided.filter((run) => run.outcome === 'accepted').length;
  const sum = (list: readonly SummaryRun[], key: 'itemsInspected' | 'nonconformingFound') =>
    list.reduce((total, run) => total + run[key], 0);

  // Only models whose total is a count per item pool (labels.pooledRate); a sum of measurements, test times or demerits has no such figure.
  const models = [...new Set(decided.map((run) => run.model))]
    .filter((model): model is ModelName => model !== null && modelLabels(model).pooledRate !== null)
    .sort();
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
      unit: modelLabels(model).pooledRate as string,
    };
  });

  const trend: DecisionTrend = { time: [], acceptedSoFar: [], rejectedSoFar: [] };
  let acceptedSoFar = 0;
  let rejectedSoFar = 0;
  for (const run of decided) {
    if (run.outcome === 'accepted') acceptedSoFar += 1;
    else rejectedSoFar += 1;
    trend.time.push(started(run) / 1000);
    trend.acceptedSoFar.push(acceptedSoFar);
    trend.rejectedSoFar.push(rejectedSoFar);
  }

  return {
    runs: runs.length,
    accepted,
    rejected: decided.length - accepted,
    open: runs.filter((run) => run.outcome === 'open' || run.outcome === 'reopened').length,
    damaged: runs.filter((run) => run.outcome === 'damaged').length,
    itemsInspected: sum(runs, 'itemsInspected'),
    nonconformingFound: sum(runs, 'nonconformingFound'),
    firstRunAt: byStart.find((run) => run.startedAt !== null)?.startedAt ?? null,
    lastRunAt: byStart.at(-1)?.startedAt ?? null,
    pooled,
    trend,
  };
}
