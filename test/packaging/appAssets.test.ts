import { readFileSync } from 'node:fs';
import { inflateSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';

const repo = new URL('../../', import.meta.url);
const manifest = JSON.parse(readFileSync(new URL('package.json', repo), 'utf8'));

/** Width, height, colour type and the top-left pixel of a PNG (PNG specification, W3C 2003: IHDR, IDAT; first pixel needs no unfiltering). */
function readPng(bytes: Buffer): { width: number; height: number; colourType: number; topLeft: number[] } {
  expect(bytes.subarray(0, 8).toString('hex')).toBe('89504e470d0a1a0a');
  let offset = 8;
  let header: Buffer | null = null;
  const data: Buffer[] = [];
  while (offset < bytes.length) {
    const length = bytes.readUInt32BE(offset);
    const type = bytes.subarray(offset + 4, offset + 8).toString('latin1');
    const body = bytes.subarray(offset + 8, offset + 8 + length);
    if (type === 'IHDR') header = body;
    if (type === 'IDAT') data.push(body);
    offset += 12 + length;
  }
  const pixels = inflateSync(Buffer.concat(data));
  return { width: header!.readUInt32BE(0), height: header!.readUInt32BE(4), colourType: header![9]!, topLeft: [...pixels.subarray(1, 5)] };
}

describe('the app icon', () => {
  it('is a 1024 x 1024 RGBA PNG (macOS asks for 1024) with transparent rounded corners', () => {
    const icon = readPng(readFileSync(new URL('assets/icon.png', repo)));
    expect([icon.width, icon.height]).toEqual([1024, 1024]);
    expect(icon.colourType).toBe(6); // truecolour with alpha
    expect(icon.topLeft[3]).toBe(0);
  });
});

describe('the package manifest', () => {
  it('names its author and the Node versions that run the app and its tests', () => {
    expect(manifest.author).toMatch(/\S/);
    expect(manifest.engines).toEqual({ node: '>=20.19' });
  });

  it('reviews the install scripts of its dependencies: esbuild needs its own, the Squirrel installer (unused) does not', () => {
    expect(manifest.allowScripts).toEqual({ esbuild: true, 'electron-winstaller': false });
  });

  it('keeps the demo data folder out of git', () => {
    expect(readFileSync(new URL('.gitignore', repo), 'utf8').split('\n')).toContain('demo-data/');
  });
});
