/**
 * The evidence chart's columns: item counts 0..horizon on x; the acceptance and rejection numbers
 * as steps; the run's cumulative count and LLR after each counted item. Voided entries are not on
 * the path: the statistics leave them out.
 */
import type uPlot from 'uplot';
import type { InspectionEntry, InspectionFrame, LifetimeFrame } from '../../../../src-main/api/channels/inspectionChannels';

export interface EvidenceColumns {
  /** x, acceptance number, rejection number, cumulative count of the run. */
  readonly counts: uPlot.AlignedData;
  /** x, ln B, ln A, LLR of the run. */
  readonly llr: uPlot.AlignedData;
}

/**
 * Measurement sums rise with n × (μ0 + μ1)/2 and both lines with them: less that midline, the
 * limits and the run stay apart at any scale. The midpoint is the lines' common slope, read off
 * the first two rows (the intercepts differ, so one row alone does not give it).
 */
function fromMidline(limits: readonly { n: number; accept: number; reject: number }[], columns: (number | null)[][]): void {
  const [first, second] = limits.filter((row) => row.accept !== row.reject); // a truncation row holds its rule, not the lines
  if (first === undefined || second === undefined) return;
  const midpoint = (second.reject - first.reject) / (second.n - first.n);
  for (const column of columns) {
    for (let n = 0; n < column.length; n++) if (column[n] !== null) column[n] = (column[n] as number) - n * midpoint;
  }
}

/** Frames whose limits are drawn against the entries counted (all but time-to-failure). */
type CountedFrame = Exclude<InspectionFrame, LifetimeFrame>;

export function evidenceColumns(frame: CountedFrame, entries: readonly InspectionEntry[]): EvidenceColumns {
  const counted = entries.filter((entry) => entry.after !== null);
  const length = Math.max(frame.horizon, counted.length) + 1;
  const x = new Float64Array(length);
  const accept: (number | null)[] = new Array(length).fill(null);
  const reject: (number | null)[] = new Array(length).fill(null);
  const total: (number | null)[] = new Array(length).fill(null);
  const llr: (number | null)[] = new Array(length).fill(null);
  const lnA = new Float64Array(length).fill(frame.lnA);
  const lnB = new Float64Array(length).fill(frame.lnB);
  for (let n = 0; n < length; n++) x[n] = n;
  for (const row of frame.limits) {
    accept[row.n] = row.accept;
    reject[row.n] = row.reject;
  }
  total[0] = 0;
  llr[0] = 0;
  for (const entry of counted) {
    const after = entry.after as NonNullable<InspectionEntry['after']>;
    total[after.n] = after.total;
    llr[after.n] = after.llr;
  }
  if (frame.model === 'measurement') fromMidline(frame.limits, [accept, reject, total]);
  return { counts: [x, accept, reject, total], llr: [x, lnB, lnA, llr] };
}

/**
 * A time-to-failure run in the (test time, failures) plane: x is accumulated test time, the
 * accept and reject lines join their points per failure count, and the run climbs one failure at
 * each failure's time. The LLR is drawn against the entries counted, as for the other models.
 */
export function lifetimeColumns(frame: LifetimeFrame, entries: readonly InspectionEntry[]): EvidenceColumns {
  const counted = entries.filter((entry) => entry.after !== null).map((entry) => entry.after as NonNullable<InspectionEntry['after']>);
  const path = new Map<number, number>([[0, 0]]);
  for (const after of counted) path.set(after.time ?? 0, after.total);
  const acceptAt = new Map<number, number>();
  const rejectAt = new Map<number, number>();
  for (const row of frame.limits) {
    if (row.acceptTime !== null) acceptAt.set(row.acceptTime, row.failures);
    if (row.rejectTime !== null && row.rejectTime >= 0) rejectAt.set(row.rejectTime, row.failures);
  }
  const times = [...new Set([...path.keys(), ...acceptAt.keys(), ...rejectAt.keys()])].sort((a, b) => a - b);
  const at = (map: Map<number, number>) => times.map((time) => map.get(time) ?? null);
  const length = counted.length + 1;
  const x = Float64Array.from({ length }, (_, n) => n);
  const llr = [0, ...counted.map((after) => after.llr)];
  return {
    counts: [Float64Array.from(times), at(acceptAt), at(rejectAt), at(path)],
    llr: [x, new Float64Array(length).fill(frame.lnB), new Float64Array(length).fill(frame.lnA), llr],
  };
}
