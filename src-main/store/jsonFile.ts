/** Read and write our own JSON files, validated with zod, with errors that name the file and field. */
import { mkdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import type { z } from 'zod';
import { writeFileAtomic, writeFileOnce } from './atomicWrite.js';

export class StoreFileError extends Error {
  readonly code = 'STORE_FILE_INVALID';
  constructor(
    readonly filePath: string,
    readonly field: string,
    detail: string,
  ) {
    super(`${filePath}: ${field === '' ? detail : `field "${field}": ${detail}`}`);
    this.name = 'StoreFileError';
  }
}

/** Read `filePath` and validate it against `schema`. */
export async function readJsonFile<Schema extends z.ZodType>(
  filePath: string,
  schema: Schema,
): Promise<z.infer<Schema>> {
  const text = await readFile(filePath, 'utf8');
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    throw new StoreFileError(filePath, '', `not valid JSON (${(error as Error).message})`);
  }
  const result = schema.safeParse(value);
  if (!result.success) {
    const issue = result.error.issues[0];
    throw new StoreFileError(filePath, issue?.path.join('.') ?? '', issue?.message ?? 'invalid');
  }
  return result.data;
}

/** Like readJsonFile, but a file that does not exist gives undefined. */
export async function readJsonFileIfPresent<Schema extends z.ZodType>(
  filePath: string,
  schema: Schema,
): Promise<z.infer<Schema> | undefined> {
  try {
    return await readJsonFile(filePath, schema);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return undefined;
    throw error;
  }
}

export function jsonText(value: unknown): string {
  return JSON.stringify(value, null, 2) + '\n';
}

export async function writeJsonFile(filePath: string, value: unknown): Promise<void> {
  await mkdir(path.dirname(filePath), { recursive: true });
  await writeFileAtomic(filePath, jsonText(value));
}

export async function writeJsonFileOnce(filePath: string, value: unknown): Promise<void> {
  await mkdir(path.dirname(filePath), { recursive: true });
  await writeFileOnce(filePath, jsonText(value));
}
