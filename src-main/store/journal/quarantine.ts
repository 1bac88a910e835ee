/**
 * The quarantine file beside a journal (`<runId>.quarantine`): torn tails cut off a journal are
 * appended here as JSON lines, never dropped silently.
 */
import { open } from 'node:fs/promises';
import type { TornTail } from './analyse.js';

export interface QuarantineRecord {
  /** When the tail was moved, UTC ISO with milliseconds. */
  readonly time: string;
  readonly journal: string;
  readonly fromByte: number;
  readonly length: number;
  /** The bytes exactly, base64. */
  readonly base64: string;
  /** The same bytes as text, for a reader's eye. */
  readonly text: string;
}

export function quarantinePathFor(journalPath: string): string {
  return journalPath.replace(/\.journal$/, '') + '.quarantine';
}

export async function appendToQuarantine(
  journalPath: string,
  tail: TornTail,
  now: Date,
): Promise<{ path: string; record: QuarantineRecord }> {
  const record: QuarantineRecord = {
    time: now.toISOString(),
    journal: journalPath,
    fromByte: tail.fromByte,
    length: tail.bytes.length,
    base64: tail.bytes.toString('base64'),
    text: tail.bytes.toString('utf8'),
  };
  const path = quarantinePathFor(journalPath);
  const handle = await open(path, 'a');
  try {
    await handle.writeFile(JSON.stringify(record) + '\n');
    await handle.sync();
  } finally {
    await handle.close();
  }
  return { path, record };
}
