import { writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { z } from 'zod';
import type { IpcRegistrar } from './ipcAdapter.js';

/** Desktop-only: the renderer hands over a record PDF to open in the system's viewer, whose Print command prints it. */
export const openRecordPdfMessage = 'tallyline-desktop:open-record-pdf';

const payloadSchema = z.object({
  fileName: z.string().regex(/^[A-Za-z0-9._-]{1,120}\.pdf$/, 'a plain file name ending in .pdf'),
  base64: z.string().max(50_000_000),
});

export interface OpenRecordPdfDependencies {
  /** A private folder of the app's own (mode 0700, made with mkdtemp, removed on quit) for records handed to the viewer. */
  folder: string;
  /** Electron's shell.openPath: resolves to '' on success or an error message. */
  openPath: (path: string) => Promise<string>;
  isTrustedUrl: (url: string) => boolean;
}

/**
 * Writes the PDF into the app's record folder and opens it with the system PDF viewer, where the
 * user prints it. Answers like a channel: `{ ok: true, value: path }` or `{ ok: false, message }`.
 */
export function registerOpenRecordPdf(ipc: Pick<IpcRegistrar, 'handle'>, dependencies: OpenRecordPdfDependencies): void {
  ipc.handle(openRecordPdfMessage, async (event, payload) => {
    if (event.senderFrame === null || !dependencies.isTrustedUrl(event.senderFrame.url)) {
      return { ok: false, code: 'internal', message: 'Request refused: it did not come from the Tallyline window.' };
    }
    const parsed = payloadSchema.safeParse(payload);
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      return { ok: false, code: 'invalid-payload', message: `${issue?.path.join('.')}: ${issue?.message}` };
    }
    const path = await writeNewFile(dependencies.folder, parsed.data.fileName, Buffer.from(parsed.data.base64, 'base64'));
    const failure = await dependencies.openPath(path);
    return failure === '' ? { ok: true, value: path } : { ok: false, code: 'internal', message: `The PDF is saved at ${path} but no viewer opened it: ${failure}` };
  });
}

/**
 * Writes bytes to a file that did not exist before (exclusive create, owner-only mode), so nothing
 * planted in the folder (a symlink, an older file) is followed or overwritten; a name already
 * taken gets a number: `record.pdf`, `record-2.pdf`, ...
 */
async function writeNewFile(folder: string, fileName: string, bytes: Buffer): Promise<string> {
  const stem = fileName.slice(0, -'.pdf'.length);
  for (let attempt = 1; ; attempt++) {
    const path = join(folder, attempt === 1 ? fileName : `${stem}-${attempt}.pdf`);
    try {
      await writeFile(path, bytes, { flag: 'wx', mode: 0o600 });
      return path;
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EEXIST' || attempt >= 1000) throw error;
    }
  }
}
