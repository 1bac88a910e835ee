/**
 * The journal race: several processes go for one run's journal at the same instant, over a stale
 * lock (its owner's pid no longer runs) or with no lock at all. Each round, every child tries once
 * to open the journal; the one that gets it appends entries and holds the journal until all others
 * have tried. Afterwards the journal must verify and hold every entry a child was told was written
 * (its seq, writer and index), and no two children may have held the lock at the same time (each
 * prints when it holds it and when it lets go; a second child may take the journal after the first
 * let go, which a loaded machine makes happen).
 *
 * Used by the short CI test (journalRace.test.ts) and by `npm run stress` (run.ts) for long runs.
 */
import { spawn } from 'node:child_process';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';
import { JournalWriter, analyseJournal, lockPathFor, verifyJournal, type JournalEntry } from '../../src-main/store/journal/index.js';

export interface RaceOptions {
  readonly rounds: number;
  /** Child processes per round. */
  readonly writers: number;
  /** Entries the lock holder appends per round. */
  readonly entries: number;
  /** How the lock stands when the children go. */
  readonly lock: 'stale' | 'fresh';
  /** How long the holder keeps the journal after its appends (ms): longer than the others take to try. */
  readonly holdMs?: number;
}

export interface RaceReport {
  readonly lock: 'stale' | 'fresh';
  readonly rounds: number;
  readonly writers: number;
  /** Entries a child was told were written and fsync'd. */
  readonly acknowledged: number;
  /** Acknowledged entries not found in the journal at their seq, with their writer and index. */
  readonly lost: number;
  /** Rounds in which two children held the lock at the same time (their hold spans overlap). */
  readonly roundsWithOverlappingHolders: number;
  /** Rounds in which a second child took the journal after the first let go (allowed). */
  readonly roundsWithSuccessiveHolders: number;
  /** Rounds in which no child got the lock. */
  readonly roundsWithNoHolder: number;
  /** Rounds whose journal did not verify afterwards. */
  readonly journalsBroken: number;
  /** Lines a child printed that were neither busy, a hold's start or end, nor an acknowledgement (errors). */
  readonly errors: string[];
  readonly seconds: number;
}

const fixture = fileURLToPath(new URL('./fixtures/raceWriter.ts', import.meta.url));

/** Bundles the child to one plain .mjs (starting tsx per child would take most of each round). */
async function bundleChild(folder: string): Promise<string> {
  const outfile = path.join(folder, 'raceWriter.mjs');
  await build({ entryPoints: [fixture], bundle: true, platform: 'node', format: 'esm', target: 'node20', outfile, logLevel: 'silent' });
  return outfile;
}

/** The pid of a process that has exited. */
async function deadPid(): Promise<number> {
  const child = spawn(process.execPath, ['-e', ''], { stdio: 'ignore' });
  await new Promise((resolve) => child.on('exit', resolve));
  return child.pid!;
}

interface ChildOutcome {
  readonly writer: string;
  readonly lines: string[];
}

/** The span in which a child certainly held the lock, from its "locked" and "releasing" lines. */
function holdSpan(outcome: ChildOutcome): { from: number; to: number } | null {
  const time = (word: string) => {
    const line = outcome.lines.find((text) => text.startsWith(`${word} `));
    return line === undefined ? null : Number(line.slice(word.length + 1));
  };
  const from = time('locked');
  if (from === null) return null;
  // A child that died before letting go held the lock to the end of the round.
  return { from, to: time('releasing') ?? Number.POSITIVE_INFINITY };
}

/** Whether any two of the spans overlap. */
function anyOverlap(spans: ReadonlyArray<{ from: number; to: number }>): boolean {
  const sorted = [...spans].sort((a, b) => a.from - b.from);
  return sorted.some((span, index) => index > 0 && span.from < sorted[index - 1].to);
}

async function raceOnce(script: string, journalPath: string, options: RaceOptions): Promise<ChildOutcome[]> {
  const children = Array.from({ length: options.writers }, (_, index) => {
    const writer = `w${index}`;
    const child = spawn(process.execPath, [script, journalPath, writer, String(options.entries), String(options.holdMs ?? 300)], {
      stdio: ['pipe', 'pipe', 'pipe'],
    });
    const lines: string[] = [];
    let buffered = '';
    let stderr = '';
    let markReady: () => void = () => undefined;
    const ready = new Promise<void>((resolve) => (markReady = resolve));
    child.stdout.on('data', (chunk: Buffer) => {
      buffered += chunk.toString();
      const complete = buffered.split('\n');
      buffered = complete.pop() ?? '';
      for (const line of complete) {
        if (line === 'ready') markReady();
        else lines.push(line);
      }
    });
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    const exited = new Promise<ChildOutcome>((resolve) =>
      child.on('exit', (code) => {
        if (code !== 0) lines.push(`error exit ${code}: ${stderr.trim().split('\n').at(-1) ?? ''}`);
        resolve({ writer, lines });
      }),
    );
    return { child, ready, exited };
  });
  await Promise.all(children.map((entry) => entry.ready));
  for (const { child } of children) child.stdin.end('go\n');
  return Promise.all(children.map((entry) => entry.exited));
}

export async function runJournalRace(options: RaceOptions): Promise<RaceReport> {
  const started = performance.now();
  const folder = await mkdtemp(path.join(os.tmpdir(), 'tallyline-race-'));
  try {
    const script = await bundleChild(folder);
    let acknowledged = 0;
    let lost = 0;
    let roundsWithOverlappingHolders = 0;
    let roundsWithSuccessiveHolders = 0;
    let roundsWithNoHolder = 0;
    let journalsBroken = 0;
    const errors: string[] = [];
    for (let round = 0; round < options.rounds; round += 1) {
      const journalPath = path.join(folder, 'runs', `race-${round}.journal`);
      const { writer } = await JournalWriter.create(journalPath, 'race', { run: { id: `race-${round}` } });
      await writer.close();
      if (options.lock === 'stale') {
        const owner = { pid: await deadPid(), token: 'e'.repeat(32), started: null, host: os.hostname() };
        await writeFile(lockPathFor(journalPath), JSON.stringify(owner) + '\n');
      }
      const outcomes = await raceOnce(script, journalPath, options);
      const spans = outcomes.map(holdSpan).filter((span) => span !== null);
      if (spans.length === 0) roundsWithNoHolder += 1;
      else if (anyOverlap(spans)) roundsWithOverlappingHolders += 1;
      else if (spans.length > 1) roundsWithSuccessiveHolders += 1;
      const bytes = await readFile(journalPath);
      const entries = analyseJournal(bytes).entries as JournalEntry<{ writer?: string; index?: number }>[];
      const bySeq = new Map(entries.map((entry) => [entry.seq, entry]));
      for (const outcome of outcomes) {
        for (const line of outcome.lines) {
          const ack = /^ack (\d+) (\d+)$/.exec(line);
          if (ack !== null) {
            acknowledged += 1;
            const found = bySeq.get(Number(ack[1]));
            if (found?.actor !== outcome.writer || found.payload.writer !== outcome.writer || found.payload.index !== Number(ack[2])) lost += 1;
          } else if (line !== 'busy' && !/^(locked|releasing) \d+(\.\d+)?$/.test(line)) {
            errors.push(`round ${round} ${outcome.writer}: ${line}`);
          }
        }
      }
      if (!(await verifyJournal(journalPath)).ok) journalsBroken += 1;
      await rm(path.dirname(journalPath), { recursive: true, force: true });
    }
    return {
      lock: options.lock,
      rounds: options.rounds,
      writers: options.writers,
      acknowledged,
      lost,
      roundsWithOverlappingHolders,
      roundsWithSuccessiveHolders,
      roundsWithNoHolder,
      journalsBroken,
      errors,
      seconds: Math.round((performance.now() - started) / 100) / 10,
    };
  } finally {
    await rm(folder, { recursive: true, force: true });
  }
}
