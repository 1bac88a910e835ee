/**
 * `npm run stress [-- --rounds N --writers W --entries E]`: the journal race (journalRace.ts) with a
 * stale lock and with a fresh one, many rounds; prints one JSON report per lock state and exits 1
 * when any acknowledged entry was lost, two children held the lock at once, a round had no holder, or
 * any journal broke.
 */
import { parseArgs } from 'node:util';
import { runJournalRace } from './journalRace.js';

const { values } = parseArgs({
  options: {
    rounds: { type: 'string', default: '100' },
    writers: { type: 'string', default: '6' },
    entries: { type: 'string', default: '25' },
  },
});
const whole = (name: string, text: string): number => {
  const value = Number(text);
  if (!Number.isInteger(value) || value < 1 || value > 100_000) throw new Error(`--${name} must be a whole number from 1 to 100000, not ${text}`);
  return value;
};
let failed = false;
for (const lock of ['stale', 'fresh'] as const) {
  const report = await runJournalRace({ lock, rounds: whole('rounds', values.rounds), writers: whole('writers', values.writers), entries: whole('entries', values.entries) });
  process.stdout.write(`${JSON.stringify({ ...report, errors: report.errors.slice(0, 10), errorCount: report.errors.length })}\n`);
  failed ||= report.lost > 0 || report.roundsWithOverlappingHolders > 0 || report.roundsWithNoHolder > 0 || report.journalsBroken > 0 || report.errors.length > 0;
}
process.exitCode = failed ? 1 : 0;
