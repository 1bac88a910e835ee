/**
 * The table under the charts, per model: what the run is compared with at each step, in the
 * model's units (acceptance/rejection numbers, sums of measurements, test times, demerits).
 */
import type { Cell } from '../../lib/tableText';
import type { LinearCountDesign } from '../../../../src-main/api/channels/planChannels';

export interface LimitsTableData {
  title: string;
  header: string[];
  rows: Cell[][];
  /** Index of the row holding the truncation rule, highlighted; null for none. */
  truncationRow: number | null;
  note: string;
  fileName: string;
}

const rounded = (digits: number) => (value: number | null) => (value === null || !Number.isFinite(value) ? null : Number(value.toFixed(digits)));

export function limitsTable(design: LinearCountDesign | null, counted: string): LimitsTableData | null {
  if (design === null) return null;
  const dash = '“–”: no acceptance (or rejection) is possible yet at that step.';
  const truncated = (index: number) => (index < 0 ? null : index);
  switch (design.model) {
    case 'measurement': {
      const unit = design.unit ?? 'units';
      const side = design.boundaries.rejectWhen === 'above' ? ['at most', 'at least'] : ['at least', 'at most'];
      const at = rounded(4);
      return {
        title: 'Limits for the sum of the measurements',
        header: ['Measurements', `Accept if the sum is ${side[0]} (${unit})`, `Reject if the sum is ${side[1]} (${unit})`],
        rows: design.limits.map((row) => [row.n, at(row.accept), at(row.reject)]),
        truncationRow: truncated(design.limits.findIndex((row) => row.n === design.truncation)),
        note: `Sums in ${unit}.${design.truncation !== null ? ' The highlighted last row is the decision at truncation.' : ''}`,
        fileName: 'measurement-limits',
      };
    }
    case 'lifetime': {
      const at = rounded(1);
      return {
        title: 'Accept and reject times per failure count',
        header: ['Failures', 'Accept once the test time reaches (h)', 'Reject if this failure comes by (h)'],
        rows: design.limits.map((row) => [row.failures, at(row.acceptTime), at(row.rejectTime)]),
        truncationRow: design.maxFailures === null ? null : truncated(design.limits.findIndex((row) => row.failures === design.maxFailures)),
        note: `Accumulated test time over all units, in hours. ${dash}`,
        fileName: 'lifetime-times',
      };
    }
    case 'graded': {
      const at = rounded(3);
      return {
        title: 'Demerit limits',
        header: ['Items graded', 'Accept if demerits at most', 'Reject if demerits at least'],
        rows: design.limits.map((row) => [row.n, at(row.accept), at(row.reject)]),
        truncationRow: truncated(design.limits.findIndex((row) => row.n === design.truncation)),
        note: `Demerits: ${design.boundaries.demerits.map((entry) => `${entry.className} ${Number(entry.demerits.toFixed(3))}`).join(', ')} per item. ${dash}`,
        fileName: 'demerit-limits',
      };
    }
    default: {
      // With pass/fail items the count cannot exceed the items inspected, so a larger rejection number cannot be reached yet.
      const reachable = (row: (typeof design.limits)[number]) => design.model !== 'passfail' || row.reject <= row.n;
      return {
        title: 'Acceptance and rejection numbers',
        header: ['Items inspected', `Accept if ${counted} at most`, `Reject if ${counted} at least`],
        rows: design.limits.map((row) => [row.n, row.accept, reachable(row) ? row.reject : null]),
        truncationRow: truncated(design.limits.findIndex((row) => row.n === design.truncation)),
        note: `“–”: no acceptance (or rejection) is possible yet at that item count.${design.truncation !== null ? ' The highlighted last row is the decision at truncation.' : ''}`,
        fileName: 'acceptance-rejection-numbers',
      };
    }
  }
}
