/**
 * The evidence chart's columns: item counts 0..horizon on x; the acceptance and rejection numbers
 * as steps; the run's cumulative count and LLR after each counted item. Voided entries are not on
 * the path: the statistics leave them out.
 */
import type uPlot from 'uplot';
import type { EvidenceFrame, InspectionEntry } from '../../../../src-main/api/channels/inspectionChannels';

export interface EvidenceColumns {
  /** x, acceptance number, rejection number, cumulative count of the run. */
  readonly counts: uPlot.AlignedData;
  /** x, ln B, ln A, LLR of the run. */
  readonly llr: uPlot.AlignedData;
}

export function evidenceColumns(frame: EvidenceFrame, entries: readonly InspectionEntry[]): EvidenceColumns {
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
  return { counts: [x, accept, reject, total], llr: [x, lnB, lnA, llr] };
}
