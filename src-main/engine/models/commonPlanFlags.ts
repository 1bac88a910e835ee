/**
 * Plan flags more than one model takes, as data, with their help lines: the risks, the truncation
 * and the display unit. Each model lists the ones it takes in its `flags.own`.
 */
import type { PlanFlag, PlanFlagReader } from './sequentialModel.js';

export const RISK_FLAGS: readonly PlanFlag[] = [
  { name: 'alpha', kind: 'probability' },
  { name: 'beta', kind: 'probability' },
];
export const RISK_USAGE = "  --alpha A --beta B         producer's and consumer's risk, each in (0, 1), alpha + beta < 1";

export const TRUNCATE_FLAG: PlanFlag = { name: 'truncate', kind: 'integer', min: 1 };
export const TRUNCATE_USAGE = '  --truncate N               decide at N items at the latest (accept iff LLR <= 0 there)';

export const UNIT_FLAG: PlanFlag = { name: 'unit', kind: 'text', what: 'A unit (e.g. mm or unit-hours)', limit: 40 };
export const UNIT_USAGE = '  --unit TEXT                measurement and lifetime: the unit of the values or test time, for display';

/** alpha and beta, both required, in that order. */
export function risksFrom(read: PlanFlagReader): { alpha: number; beta: number } {
  const alpha = read.need<number>('alpha');
  return { alpha, beta: read.need<number>('beta') };
}

/** The truncation from --truncate, null when not given. */
export function truncationFrom(read: PlanFlagReader): number | null {
  return read.given<number>('truncate') ?? null;
}

/** `{ unit }` when --unit was given, else nothing (the spec then has no unit key). */
export function unitFrom(read: PlanFlagReader): { unit?: string } {
  const unit = read.given<string>('unit');
  return unit === undefined ? {} : { unit };
}
