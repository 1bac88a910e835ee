/** The runs of the data folder as the history needs them: each run's summary joined with its plan version. */
import type { RunSummary } from '../inspection/index.js';
import { PlanRepository, type PlanVersion } from '../store/index.js';
import type { HistoryRun } from './sourceSummary.js';

/** Reads each plan version once, however many runs used it. */
export function historyRunReader(dataDirectory: string): (runs: readonly RunSummary[]) => Promise<HistoryRun[]> {
  const plans = new PlanRepository(dataDirectory);
  const known = new Map<string, Promise<PlanVersion | undefined>>();
  const planOf = (run: RunSummary) => {
    const key = `${run.planId}@${run.planVersion}`;
    if (!known.has(key)) known.set(key, plans.get(run.planId, run.planVersion).catch(() => undefined));
    return known.get(key) as Promise<PlanVersion | undefined>;
  };
  return (runs) =>
    Promise.all(
      runs.map(async (run): Promise<HistoryRun> => {
        const plan = await planOf(run);
        const model = plan?.spec.model ?? 'passfail';
        return {
          id: run.id,
          startedAt: run.createdAt,
          lot: run.lot,
          planName: run.planName,
          part: plan?.part ?? null,
          characteristic: plan?.characteristic ?? null,
          // A run whose plan file is gone still counts; pass/fail is the model every plan had before count.
          model,
          status: run.status,
          decision: run.decision,
          itemsInspected: run.n,
          // A sum of measurements, failures or demerits is not a count of nonconforming items.
          nonconformingFound: model === 'passfail' || model === 'count' ? run.total : 0,
          verified: run.ok,
        };
      }),
    );
}
