import { describe, expect, it } from 'vitest';
import { runJournalRace } from './journalRace.js';

// The short form of `npm run stress`: a few rounds of five processes going for one journal at once.
describe('processes racing for one run journal', () => {
  for (const lock of ['stale', 'fresh'] as const) {
    it(`over a ${lock} lock: no two hold the journal at once, and every acknowledged entry is in the journal`, async () => {
      const report = await runJournalRace({ lock, rounds: 3, writers: 5, entries: 10 });
      expect(report.errors).toEqual([]);
      expect(report.roundsWithOverlappingHolders).toBe(0);
      expect(report.roundsWithNoHolder).toBe(0);
      // Each holder appends its 10 entries; a second holder after the first let go appends 10 more.
      expect(report.acknowledged).toBe((3 + report.roundsWithSuccessiveHolders) * 10);
      expect(report.lost).toBe(0);
      expect(report.journalsBroken).toBe(0);
    });
  }
});
