import { readFile } from 'node:fs/promises';
import { extname, join, normalize, sep } from 'node:path';

const contentTypes: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.ico': 'image/x-icon',
  '.woff2': 'font/woff2',
  '.json': 'application/json; charset=utf-8',
};

export interface StaticFile {
  body: Buffer;
  contentType: string;
}

/**
 * Reads one file of the built renderer. Paths that climb out of the folder are refused; an
 * unknown path under the root gets index.html, so a reload of any screen works.
 */
export async function readStaticFile(root: string, urlPath: string): Promise<StaticFile | null> {
  const relative = normalize(decodeURIComponent(urlPath)).replace(/^([/\\])+/, '');
  if (relative.split(sep).includes('..')) return null;
  const wanted = relative === '' ? 'index.html' : relative;
  for (const candidate of [wanted, 'index.html']) {
    try {
      const body = await readFile(join(root, candidate));
      return { body, contentType: contentTypes[extname(candidate)] ?? 'application/octet-stream' };
    } catch {
      if (extname(wanted) !== '') return null; // a missing asset is a 404, not the page
    }
  }
  return null;
}
