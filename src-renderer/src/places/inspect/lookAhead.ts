/**
 * What a measurement, time-to-failure or graded run needs from here, as cells for the "From here"
 * panel: the shortest ways to a decision in the model's units, the exact (or simulated) chance of
 * accepting and the evidence still expected.
 */
import type { InspectionLive } from '../../../../src-main/api/channels/inspectionChannels';
import { countOf } from '../../lib/words';
import type { LinearCountLiveState } from '../../../../src-main/engine/index';
import { figure } from '../../lib/format';
import type { ModelWords } from './modelWords';

export type ExtendedLive = Exclude<InspectionLive, { model?: undefined }>;

export interface LookAheadCell {
  label: string;
  value: string;
  testid: string;
  note?: string;
}

export interface LookAhead {
  cells: LookAheadCell[];
  /** What is still expected, in words: "items still to inspect", "test hours still to run". */
  remainingWord: string;
  remainingH0: number;
  remainingH1: number;
  method: string;
  tally: { label: string; value: string; testid: string }[];
}

const amount = (value: number | null, digits: number) => (value === null ? '–' : figure(value, digits));

/** Pass/fail and count runs: items until an accept is possible, nonconforming items that would reject. */
function linearLookAhead(live: LinearCountLiveState, words: ModelWords): LookAhead {
  const open = live.decision === 'continue';
  const one = words.items === 'units' ? 'unit' : 'item';
  const rejectWithin =
    open && live.itemsToEarliestReject !== null
      ? live.itemsToEarliestReject === 1
        ? `on the next ${one}`
        : `within the next ${countOf(live.itemsToEarliestReject, words.items)}`
      : undefined;
  return {
    cells: [
      {
        label: `${words.items === 'units' ? 'clean units' : 'passing items'} until an accept is possible`,
        value: !open ? '–' : live.itemsToEarliestAccept === null ? 'not before truncation' : String(live.itemsToEarliestAccept),
        testid: 'next-accept',
      },
      { label: `${words.counted} that would reject`, value: !open || live.nonconformingToReject === null ? '–' : String(live.nonconformingToReject), testid: 'next-reject', note: rejectWithin },
    ],
    remainingWord: `${words.items} still to inspect`,
    remainingH0: live.expectedRemainingH0,
    remainingH1: live.expectedRemainingH1,
    method: 'exact',
    tally: [
      { label: `${words.items} counted`, value: String(live.n), testid: 'counted-n' },
      { label: words.countedShort, value: String(live.total), testid: 'counted-total' },
    ],
  };
}

export function lookAhead(live: InspectionLive, words: ModelWords, unit: string): LookAhead {
  return live.model === undefined ? linearLookAhead(live, words) : extendedLookAhead(live, unit);
}

function extendedLookAhead(live: ExtendedLive, unit: string): LookAhead {
  const open = live.decision === 'continue';
  if (live.model === 'measurement') {
    const [acceptWord, rejectWord] = live.nextValueAccepts !== null && live.nextValueRejects !== null && live.nextValueAccepts > live.nextValueRejects ? ['at least', 'at most'] : ['at most', 'at least'];
    return {
      cells: [
        { label: 'Next value that accepts at once', value: open ? amount(live.nextValueAccepts, 3) : '–', testid: 'next-accept', note: open && live.nextValueAccepts !== null ? `${acceptWord}, ${unit}` : undefined },
        { label: 'Next value that rejects at once', value: open ? amount(live.nextValueRejects, 3) : '–', testid: 'next-reject', note: open && live.nextValueRejects !== null ? `${rejectWord}, ${unit}` : undefined },
      ],
      remainingWord: 'measurements still to take',
      remainingH0: live.expectedRemainingH0,
      remainingH1: live.expectedRemainingH1,
      method: 'exact',
      tally: [
        { label: 'measurements', value: String(live.n), testid: 'counted-n' },
        { label: `mean${unit ? ` (${unit})` : ''}`, value: amount(live.mean, 4), testid: 'counted-mean' },
      ],
    };
  }
  if (live.model === 'lifetime') {
    return {
      cells: [
        { label: 'Test time still needed to accept with no failure', value: open ? amount(live.timeToAccept, 1) : '–', testid: 'next-accept', note: open ? 'hours' : undefined },
        { label: 'Failures now that would reject', value: open && live.failuresToReject !== null ? String(live.failuresToReject) : '–', testid: 'next-reject' },
      ],
      remainingWord: 'test hours still to run',
      remainingH0: live.expectedRemainingTimeH0,
      remainingH1: live.expectedRemainingTimeH1,
      method: 'exact',
      tally: [
        { label: 'hours on test', value: figure(live.time, 1), testid: 'counted-time' },
        { label: 'failures', value: String(live.failures), testid: 'counted-total' },
        { label: 'MTBF so far (h)', value: amount(live.estimate, 0), testid: 'mtbf-estimate' },
      ],
    };
  }
  const toAccept = live.acceptDemerits === null ? null : live.acceptDemerits - live.demerits;
  return {
    cells: [
      { label: 'Demerits now: accept at most', value: open ? amount(live.acceptDemerits, 2) : '–', testid: 'next-accept', note: open && toAccept !== null && toAccept < 0 ? 'more reference-class items bring it down' : undefined },
      { label: 'Demerits that would reject', value: open ? figure(live.rejectDemerits - live.demerits, 2) : '–', testid: 'next-reject', note: open ? `on top of the ${figure(live.demerits, 2)} so far` : undefined },
    ],
    remainingWord: 'items still to grade',
    remainingH0: live.expectedRemainingH0,
    remainingH1: live.expectedRemainingH1,
    method: live.method,
    tally: [
      { label: 'items graded', value: String(live.n), testid: 'counted-n' },
      { label: 'per class', value: live.counts.join(' / '), testid: 'class-counts' },
      { label: 'demerits', value: figure(live.demerits, 2), testid: 'counted-total' },
    ],
  };
}
