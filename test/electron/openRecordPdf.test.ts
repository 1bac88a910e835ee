import { mkdtemp, readFile, rm, stat, symlink, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { isAppUrl } from '../../src-main/electron/appProtocol.js';
import type { IpcInvokeEvent } from '../../src-main/electron/ipcAdapter.js';
import { openRecordPdfMessage, registerOpenRecordPdf } from '../../src-main/electron/openRecordPdf.js';

const folders: string[] = [];
afterEach(async () => {
  await Promise.all(folders.splice(0).map((folder) => rm(folder, { recursive: true, force: true })));
});

async function setUp(openPathAnswer = '') {
  const folder = await mkdtemp(join(tmpdir(), 'tallyline-print-'));
  folders.push(folder);
  const opened: string[] = [];
  let handler: ((event: IpcInvokeEvent, payload: unknown) => Promise<unknown>) | undefined;
  registerOpenRecordPdf(
    { handle: (channel, listener) => void (channel === openRecordPdfMessage && (handler = listener)) },
    { folder, openPath: async (path) => (opened.push(path), openPathAnswer), isTrustedUrl: isAppUrl },
  );
  return { folder, opened, call: (url: string, payload: unknown) => handler!({ senderFrame: { url } }, payload) };
}

const pdfBase64 = Buffer.from('%PDF-1.4 test').toString('base64');

describe('opening a record PDF from the desktop window', () => {
  it('writes the PDF into its folder and opens it in the system viewer', async () => {
    const { folder, opened, call } = await setUp();
    const answer = await call('tallyline://app/index.html', { fileName: 'record-KF-1.pdf', base64: pdfBase64 });
    expect(answer).toEqual({ ok: true, value: join(folder, 'record-KF-1.pdf') });
    expect(opened).toEqual([join(folder, 'record-KF-1.pdf')]);
    expect((await readFile(join(folder, 'record-KF-1.pdf'), 'utf8')).startsWith('%PDF-')).toBe(true);
  });

  it('refuses a file name that could leave its folder', async () => {
    const { opened, call } = await setUp();
    const answer = await call('tallyline://app/index.html', { fileName: '../../.bashrc.pdf', base64: pdfBase64 });
    expect(answer).toMatchObject({ ok: false, code: 'invalid-payload' });
    expect(opened).toEqual([]);
  });

  it('refuses a request from any frame but the app', async () => {
    const { opened, call } = await setUp();
    expect(await call('https://attacker.example/', { fileName: 'a.pdf', base64: pdfBase64 })).toMatchObject({ ok: false });
    expect(opened).toEqual([]);
  });

  it('says where the PDF is when no viewer opens it', async () => {
    const { call } = await setUp('No application is registered for .pdf');
    const answer = await call('tallyline://app/index.html', { fileName: 'a.pdf', base64: pdfBase64 });
    expect(answer).toMatchObject({ ok: false });
    expect((answer as { message: string }).message).toContain('No application is registered');
  });

  it('never follows a file planted under the same name: the record gets a new name, owner-only, and the planted target is untouched', async () => {
    const { folder, opened, call } = await setUp();
    const target = join(folder, 'elsewhere.txt');
    await writeFile(target, 'keep me');
    await symlink(target, join(folder, 'record-KF-1.pdf'));
    const answer = await call('tallyline://app/index.html', { fileName: 'record-KF-1.pdf', base64: pdfBase64 });
    expect(answer).toEqual({ ok: true, value: join(folder, 'record-KF-1-2.pdf') });
    expect(opened).toEqual([join(folder, 'record-KF-1-2.pdf')]);
    expect(await readFile(target, 'utf8')).toBe('keep me');
    expect((await stat(join(folder, 'record-KF-1-2.pdf'))).mode & 0o777).toBe(0o600);
  });
});
