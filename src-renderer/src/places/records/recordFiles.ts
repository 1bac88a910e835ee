/**
 * Files of the Records place as downloads. The record PDF travels base64 over the channel and is
 * handed over as bytes; the CSV goes through the shared text download.
 */
export { downloadText } from '../../lib/download';

/** Decodes base64 and offers the bytes as a download named `fileName`. */
export function downloadBase64(fileName: string, base64: string, type: string): void {
  const binary = atob(base64);
  const bytes = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i++) bytes[i] = binary.charCodeAt(i);
  const url = URL.createObjectURL(new Blob([bytes], { type }));
  const link = Object.assign(document.createElement('a'), { href: url, download: fileName, rel: 'noopener' });
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}
