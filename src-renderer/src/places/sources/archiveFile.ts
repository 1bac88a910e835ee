/** The backup archive crosses the channel as base64: read back from a picked file here. */
/** A picked file as base64, in chunks so a large file does not overflow the argument list. */
export async function fileAsBase64(file: File): Promise<string> {
  const bytes = new Uint8Array(await file.arrayBuffer());
  let binary = '';
  for (let start = 0; start < bytes.length; start += 0x8000) binary += String.fromCharCode(...bytes.subarray(start, start + 0x8000));
  return btoa(binary);
}
