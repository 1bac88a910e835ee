/**
 * The integer form of a plan over the cumulative count: acceptance and rejection numbers per item
 * count, and the rule at truncation.
 */
export interface IntegerLines {
  h1: number;
  h2: number;
  slope: number;
  /** Item count at which the plan must decide, or null for none. */
  truncation: number | null;
}

/** Absolute guard (scaled by the size of the value) so a point exactly on a line counts as on it. */
const GUARD = 1e-12;

function guarded(x: number): number {
  return GUARD * Math.max(1, Math.abs(x));
}

/**
 * Acceptance number after n items: the largest cumulative count that accepts, or null while no
 * acceptance is possible yet.
 *
 * Method: Ac(n) = floor(slope n - h1), floor taken with a 1e-12 guard so d = slope n - h1 exactly
 * accepts ("on or below the line accepts").
 * References: NIST/SEMATECH e-Handbook of Statistical Methods (2012), §6.2.6.
 */
export function acceptanceNumber(lines: IntegerLines, n: number): number | null {
  const raw = rawAcceptanceNumber(lines, n);
  return raw < 0 ? null : raw;
}

/**
 * Ac(n) as an integer that may be negative (no acceptance yet); for hot loops.
 *
 * Method and References: as acceptanceNumber.
 */
export function rawAcceptanceNumber(lines: IntegerLines, n: number): number {
  const x = lines.slope * n - lines.h1;
  return Math.floor(x + guarded(x));
}

/**
 * Rejection number after n items: the smallest cumulative count that rejects.
 *
 * Method: Re(n) = ceil(slope n + h2), ceil taken with a 1e-12 guard so d = slope n + h2 exactly
 * rejects ("on or above the line rejects").
 * References: NIST/SEMATECH e-Handbook of Statistical Methods (2012), §6.2.6.
 */
export function rejectionNumber(lines: IntegerLines, n: number): number {
  const x = lines.slope * n + lines.h2;
  return Math.ceil(x - guarded(x));
}

/**
 * The acceptance number at truncation: accept iff LLR <= 0, i.e. d <= slope n_t.
 *
 * Method: floor(slope n_t) with the same 1e-12 guard.
 * References: exact recursion over the integer lines (computed independently, checked by simulation): the rule "at n_t accept iff
 * d <= floor(s n_t)" is a stated choice, not a standard.
 */
export function truncationAcceptanceNumber(lines: IntegerLines): number | null {
  return lines.truncation === null ? null : neutralCount(lines, lines.truncation);
}

/**
 * The largest count with LLR <= 0 after n items.
 *
 * Method: LLR = k (d - s n) <= 0 iff d <= s n, so floor(s n) with the 1e-12 guard.
 * References: exact recursion over the integer lines (computed independently, checked by simulation).
 */
export function neutralCount(lines: IntegerLines, n: number): number {
  const x = lines.slope * n;
  return Math.floor(x + guarded(x));
}

export type Decision = 'continue' | 'accept' | 'reject';

export interface DecisionAt {
  decision: Decision;
  /** In words: which rule decided. */
  rule: string;
}

/**
 * The decision after n items with cumulative count `total`, by the integer lines and truncation.
 *
 * Method: reject iff total >= Re(n); accept iff total <= Ac(n); at n >= n_t accept iff
 * total <= floor(slope n_t) ("accept at truncation"), else "reject at truncation".
 * References: Wald, A. (1947), Sequential Analysis, ch. 3; NIST/SEMATECH e-Handbook §6.2.6.
 */
export function decisionAt(lines: IntegerLines, n: number, total: number): DecisionAt {
  const rejection = rejectionNumber(lines, n);
  if (total >= rejection) {
    return { decision: 'reject', rule: `reject: count ${total} >= rejection number ${rejection} at n = ${n}` };
  }
  const acceptance = rawAcceptanceNumber(lines, n);
  if (total <= acceptance) {
    return { decision: 'accept', rule: `accept: count ${total} <= acceptance number ${acceptance} at n = ${n}` };
  }
  if (lines.truncation !== null && n >= lines.truncation) {
    const limit = truncationAcceptanceNumber(lines) as number;
    return total <= limit
      ? { decision: 'accept', rule: `accept at truncation: count ${total} <= ${limit} at n = ${lines.truncation}` }
      : { decision: 'reject', rule: `reject at truncation: count ${total} > ${limit} at n = ${lines.truncation}` };
  }
  const acceptText = acceptance < 0 ? 'no acceptance number yet' : `acceptance number ${acceptance}`;
  return {
    decision: 'continue',
    rule: `continue: count ${total} between ${acceptText} and rejection number ${rejection} at n = ${n}`,
  };
}
