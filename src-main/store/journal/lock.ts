/**
 * A lock file beside a journal (`<runId>.lock`) so that two processes never append to one journal
 * at once. It holds its owner: `{"pid", "token", "started", "host"}` (one JSON line).
 *
 * Method:
 * - Take: the owner record is written to a temp file, then hard-linked to the lock's name. `link`
 *   fails with EEXIST when a lock exists, so the lock appears complete or not at all, and of two
 *   takers exactly one succeeds.
 * - Stale: the owner is gone when no process has its pid on this host, or the process with that pid
 *   started at another time than recorded (a recycled pid; Linux `/proc/<pid>/stat` field 22), or
 *   the pid is this very process but the token is not one it holds. A lock of another host is
 *   never judged stale (its pid means nothing here).
 * - Take over a stale lock: first claim the right to replace exactly that lock, a marker
 *   `.<runId>.lock.takeover-<SHA-256 of the stale lock's bytes>` taken by the same link rule (and
 *   itself taken over the same way if its claimant died). The marker's holder re-reads the lock,
 *   and only if it still holds the stale bytes renames a freshly written temp file over it, then
 *   re-reads it to check it is its own. Two takers that both judged the same lock stale compete
 *   for one marker, so at most one replaces it; a lock, once replaced, never holds those bytes
 *   again (each carries a random token), so a late claimant finds it changed and backs off.
 * Temp and marker files start with "." so backups leave them out.
 */
import { randomBytes, createHash } from 'node:crypto';
import { link, readFile, rename, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { JournalBusyError } from './errors.js';

export interface JournalLock {
  readonly path: string;
  release(): Promise<void>;
}

/** Who holds a lock, as recorded in it. */
export interface LockOwner {
  readonly pid: number;
  /** Random, unique per lock taken; absent in a lock holding only a pid. */
  readonly token: string | null;
  /** The owner's process start as the platform gives it (e.g. "linux:<ticks since boot>"), or null. */
  readonly started: string | null;
  readonly host: string | null;
}

/** Tokens of the locks this process holds or is taking: a lock with our pid and another token is stale. */
const heldTokens = new Set<string>();
/** Bounds the chain of takeovers of takeovers (each level needs a claimant that died mid-takeover). */
const MAX_TAKEOVER_DEPTH = 4;
const ATTEMPTS = 8;

export function lockPathFor(journalPath: string): string {
  return journalPath.replace(/\.journal$/, '') + '.lock';
}

export async function acquireJournalLock(journalPath: string): Promise<JournalLock> {
  const lockPath = lockPathFor(journalPath);
  const token = randomBytes(16).toString('hex');
  const owner: LockOwner = { pid: process.pid, token, started: await processStart(process.pid), host: os.hostname() };
  const ours = Buffer.from(JSON.stringify(owner) + '\n', 'utf8');
  heldTokens.add(token);
  try {
    for (let attempt = 0; attempt < ATTEMPTS; attempt += 1) {
      const outcome = await claim(lockPath, ours, 0);
      if (outcome.kind === 'taken') return { path: lockPath, release: () => release(lockPath, ours, token) };
      if (outcome.kind === 'busy') throw new JournalBusyError(journalPath, outcome.holder.pid, outcome.holder.host);
      // 'changed': released or taken over while we looked; look again.
    }
  } catch (error) {
    heldTokens.delete(token);
    throw error;
  }
  heldTokens.delete(token);
  throw new Error(`could not take the lock ${lockPath}: it changed hands ${ATTEMPTS} times while being taken`);
}

/** The live owner of a lock file, or null when there is no lock or its owner is gone. */
export async function liveLockOwner(lockPath: string): Promise<LockOwner | null> {
  const bytes = await readIfExists(lockPath);
  if (bytes === null) return null;
  const owner = parseOwner(bytes);
  return owner !== null && (await ownerIsAlive(owner)) ? owner : null;
}

type Claim = { kind: 'taken' } | { kind: 'busy'; holder: LockOwner } | { kind: 'changed' };

async function claim(target: string, ours: Buffer, depth: number): Promise<Claim> {
  if (await linkIntoPlace(target, ours)) return { kind: 'taken' };
  const current = await readIfExists(target);
  if (current === null) return { kind: 'changed' };
  const holder = parseOwner(current);
  if (holder !== null && (await ownerIsAlive(holder))) return { kind: 'busy', holder };
  if (depth >= MAX_TAKEOVER_DEPTH) return { kind: 'busy', holder: holder ?? { pid: 0, token: null, started: null, host: null } };
  const marker = takeoverMarkerPath(target, current);
  const right = await claim(marker, ours, depth + 1);
  if (right.kind !== 'taken') return right;
  try {
    const still = await readIfExists(target);
    if (still === null || !still.equals(current)) return { kind: 'changed' };
    await replaceWith(target, ours);
    const after = await readIfExists(target);
    return after !== null && after.equals(ours) ? { kind: 'taken' } : { kind: 'changed' };
  } finally {
    await rm(marker, { force: true });
  }
}

async function release(lockPath: string, ours: Buffer, token: string): Promise<void> {
  try {
    // Only our own lock is removed; nobody replaces a live owner's lock, so it cannot change in between.
    const current = await readIfExists(lockPath);
    if (current !== null && current.equals(ours)) await rm(lockPath, { force: true });
  } finally {
    heldTokens.delete(token);
  }
}

/** Writes `bytes` to a temp file and links it to `target`; false when `target` exists. */
async function linkIntoPlace(target: string, bytes: Buffer): Promise<boolean> {
  const temp = tempPathFor(target);
  await writeFile(temp, bytes, { flag: 'wx', mode: 0o644 });
  try {
    await link(temp, target);
    return true;
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'EEXIST') return false;
    throw error;
  } finally {
    await rm(temp, { force: true });
  }
}

async function replaceWith(target: string, bytes: Buffer): Promise<void> {
  const temp = tempPathFor(target);
  await writeFile(temp, bytes, { flag: 'wx', mode: 0o644 });
  try {
    await rename(temp, target);
  } catch (error) {
    await rm(temp, { force: true });
    throw error;
  }
}

function tempPathFor(target: string): string {
  const name = path.basename(target).replace(/^\./, '');
  return path.join(path.dirname(target), `.${name}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`);
}

function takeoverMarkerPath(target: string, staleBytes: Buffer): string {
  const name = path.basename(target).replace(/^\./, '').replace(/\.takeover-[0-9a-f]+$/, '');
  const identity = createHash('sha256').update(staleBytes).digest('hex').slice(0, 32);
  return path.join(path.dirname(target), `.${name}.takeover-${identity}`);
}

async function readIfExists(file: string): Promise<Buffer | null> {
  try {
    return await readFile(file);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
    throw error;
  }
}

/** The owner a lock records; a bare pid (older locks) is read as such; anything else is null (owner unknown). */
export function parseOwner(bytes: Buffer): LockOwner | null {
  const text = bytes.toString('utf8').trim();
  if (/^\d{1,10}$/.test(text)) return { pid: Number(text), token: null, started: null, host: null };
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    return null;
  }
  if (typeof value !== 'object' || value === null) return null;
  const record = value as Record<string, unknown>;
  if (!Number.isSafeInteger(record.pid) || (record.pid as number) <= 0) return null;
  const text_ = (field: unknown): string | null => (typeof field === 'string' ? field : null);
  return { pid: record.pid as number, token: text_(record.token), started: text_(record.started), host: text_(record.host) };
}

async function ownerIsAlive(owner: LockOwner): Promise<boolean> {
  if (owner.host !== null && owner.host !== os.hostname()) return true;
  if (!isAlive(owner.pid)) return false;
  if (owner.started !== null) {
    const started = await processStart(owner.pid);
    if (started !== null && started !== owner.started) return false;
  }
  if (owner.pid === process.pid && owner.token !== null) return heldTokens.has(owner.token);
  return true;
}

/** Whether a process with this pid runs (EPERM: it does, under another user). */
export function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/**
 * When a process started, as "linux:<clock ticks after boot>" from `/proc/<pid>/stat` (field 22,
 * counted after the parenthesised command name, which may hold spaces), or null where the platform
 * does not tell (then a lock's pid alone decides).
 */
export async function processStart(pid: number): Promise<string | null> {
  if (process.platform !== 'linux') return null;
  try {
    const stat = await readFile(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    const ticks = fields[19];
    return ticks !== undefined && /^\d+$/.test(ticks) ? `linux:${ticks}` : null;
  } catch {
    return null;
  }
}
