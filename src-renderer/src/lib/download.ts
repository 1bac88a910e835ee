/**
 * Hands a text file to the user as a download. Works the same in the browser host and inside
 * Electron's renderer, so saving a file needs no channel and the renderer never touches disk.
 */
export function downloadText(fileName: string, text: string, type = 'application/json'): void {
  downloadBlob(fileName, new Blob([text], { type }));
}

/** Bytes that crossed a channel as base64 (a record PDF, a backup archive), offered as a download. */
export function downloadBase64(fileName: string, base64: string, type: string): void {
  const binary = atob(base64);
  const bytes = new Uint8Array(binary.length);
  for (let index = 0; index < binary.length; index += 1) bytes[index] = binary.charCodeAt(index);
  downloadBlob(fileName, new Blob([bytes], { type }));
}

function downloadBlob(fileName: string, blob: Blob): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  link.rel = 'noopener';
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** Reads a file the user picked, as text; refuses files too large to be what we expect. */
export async function readPickedFile(file: File, maximumBytes: number): Promise<{ ok: true; text: string } | { ok: false; message: string }> {
  if (file.size > maximumBytes) {
    return { ok: false, message: `${file.name} is ${Math.ceil(file.size / 1024)} kB; a plan file is at most ${Math.floor(maximumBytes / 1024)} kB.` };
  }
  return { ok: true, text: await file.text() };
}
