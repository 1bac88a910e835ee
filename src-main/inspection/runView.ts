/** A run as readers are handed it (RunView), from its replay and what the read found about its journal. */
import { outcomeOf, type RunDamage } from './runCatalogue.js';
import type { RunReplay } from './runReplay.js';
import type { RunView } from './runTypes.js';

export type RunViewFacts = Pick<RunView, 'writable' | 'problems' | 'recovered'> & {
  readonly fingerprint: string | null;
  readonly damage: RunDamage | null;
};

export function runView(replay: RunReplay, facts: RunViewFacts): RunView {
  const state = replay.evidence.state();
  const close = replay.status === 'closed' ? replay.lastClose : null;
  return {
    run: {
      ...replay.header.run,
      status: replay.status,
      sourceName: replay.header.source.name,
      closedAt: close?.time ?? null,
      decision: close?.decision ?? null,
      rule: close?.rule ?? null,
      fingerprint: facts.fingerprint,
    },
    outcome: outcomeOf(replay, facts.damage),
    plan: replay.header.plan,
    entries: replay.results.map((entry) => ({ ...entry })),
    state,
    writable: facts.writable,
    problems: facts.problems,
    recovered: facts.recovered,
  };
}
