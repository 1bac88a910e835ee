import { readStaticFile } from '../host/staticFiles.js';
import { contentSecurityPolicy } from '../host/contentSecurityPolicy.js';

/** The renderer is served from this scheme and host rather than file://. */
export const appScheme = 'tallyline';
export const appOrigin = `${appScheme}://app`;

export function isAppUrl(url: string): boolean {
  return url === appOrigin || url.startsWith(`${appOrigin}/`);
}

/**
 * Origins the window may open in the user's browser. The app links to nothing outside itself
 * today, so the list is empty and every external address is refused; add an origin here with the
 * link that needs it.
 */
export const externalLinkOrigins: readonly string[] = [];

export function isAllowedExternalUrl(url: string): boolean {
  try {
    const parsed = new URL(url);
    return parsed.protocol === 'https:' && externalLinkOrigins.includes(parsed.origin);
  } catch {
    return false;
  }
}

/** Answers a request for the app protocol from the built renderer folder. */
export async function serveAppRequest(rendererRoot: string, requestUrl: string): Promise<Response> {
  const url = new URL(requestUrl);
  if (url.host !== 'app') return new Response('Not found.', { status: 404 });
  const file = await readStaticFile(rendererRoot, url.pathname);
  if (!file) return new Response('Not found.', { status: 404 });
  return new Response(new Uint8Array(file.body), {
    headers: { 'content-type': file.contentType, 'content-security-policy': contentSecurityPolicy },
  });
}
