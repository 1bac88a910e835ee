/**
 * One `feed` input line as a result of the run's plan model:
 * passfail `pass`/`fail` or 1/0; count a whole number; measurement a number; lifetime `time T`
 * (accumulated test time), `fail` (a failure now) or `fail T` (time reaches T, then a failure);
 * graded a class name or its 0-based index.
 */
import type { PlanSpec } from '../engine/index.js';
import { gradeIndex, type ItemResult } from '../inspection/index.js';
import { NUMBER_TEXT } from './flags.js';

const PASS_FAIL_WORDS: Record<string, ItemResult> = { pass: 'pass', fail: 'fail', '0': 'pass', '1': 'fail' };

export type FeedLine = { result: ItemResult } | { problem: string } | null;

/** The result on one input line, null for a blank or # comment line, or a sentence saying what is wrong. */
export function parseFeedLine(spec: PlanSpec, line: string): FeedLine {
  const text = line.trim();
  if (text === '' || text.startsWith('#')) return null;
  const quoted = JSON.stringify(text);
  switch (spec.model) {
    case 'passfail': {
      const result = PASS_FAIL_WORDS[text.toLowerCase()];
      return result === undefined ? { problem: `${quoted} is not pass, fail, 0 or 1` } : { result };
    }
    case 'count':
      return /^\d+$/.test(text) && Number.isSafeInteger(Number(text))
        ? { result: Number(text) }
        : { problem: `${quoted} is not a whole number of nonconformities (0 or more)` };
    case 'measurement':
      return NUMBER_TEXT.test(text) && Number.isFinite(Number(text))
        ? { result: { value: Number(text) } }
        : { problem: `${quoted} is not a measured value (a number such as 10.03)` };
    case 'lifetime': {
      const match = /^(time|fail)(?:\s+(\S+))?$/i.exec(text);
      const at = match?.[2];
      const allowed = `${quoted} is not "time T", "fail" or "fail T" (T the accumulated test time, a number of 0 or more)`;
      if (match === null || (at !== undefined && !NUMBER_TEXT.test(at)) || (at !== undefined && Number(at) < 0)) return { problem: allowed };
      if (match[1].toLowerCase() === 'time') return at === undefined ? { problem: allowed } : { result: { time: Number(at) } };
      return { result: at === undefined ? { failure: true } : { failure: true, time: Number(at) } };
    }
    case 'graded': {
      const byName = gradeIndex(spec.classes, text);
      const index = byName >= 0 ? byName : /^\d+$/.test(text) && Number(text) < spec.classes.length ? Number(text) : -1;
      return index < 0
        ? { problem: `${quoted} is not a class of this plan (${spec.classes.join(', ')}) or its index 0 to ${spec.classes.length - 1}` }
        : { result: { grade: spec.classes[index] } };
    }
  }
}
