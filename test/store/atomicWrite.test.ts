import { describe, expect, it } from 'vitest';
import { readFile, readdir, rename, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { writeFileAtomic } from '../../src-main/store/atomicWrite.js';
import { tempFolder } from './helpers.js';

describe('writeFileAtomic', () => {
  it('replaces a file and leaves no temp file behind', async () => {
    const folder = await tempFolder();
    const target = path.join(folder, 'settings.json');
    await writeFile(target, 'old');
    await writeFileAtomic(target, 'new contents');
    expect(await readFile(target, 'utf8')).toBe('new contents');
    expect(await readdir(folder)).toEqual(['settings.json']);
  });

  it('retries a rename that a Windows lock refuses with EBUSY, then succeeds', async () => {
    const folder = await tempFolder();
    const target = path.join(folder, 'plan.json');
    let refusals = 2;
    const flakyRename = async (from: string, to: string): Promise<void> => {
      if (refusals-- > 0) throw Object.assign(new Error('busy'), { code: 'EBUSY' });
      await rename(from, to);
    };
    await writeFileAtomic(target, 'x', { rename: flakyRename });
    expect(await readFile(target, 'utf8')).toBe('x');
    expect(refusals).toBe(-1);
  });

  it('keeps the old contents and removes the temp file when the rename fails for good', async () => {
    const folder = await tempFolder();
    const target = path.join(folder, 'plan.json');
    await writeFile(target, 'old');
    const brokenRename = async (): Promise<void> => {
      throw Object.assign(new Error('no space'), { code: 'ENOSPC' });
    };
    await expect(writeFileAtomic(target, 'new', { rename: brokenRename })).rejects.toThrow('no space');
    expect(await readFile(target, 'utf8')).toBe('old');
    expect(await readdir(folder)).toEqual(['plan.json']);
  });
});
