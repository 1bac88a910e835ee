import { readStaticFile } from '../host/staticFiles.js';
import { contentSecurityPolicy } from '../host/contentSecurityPolicy.js';

/** The renderer is served from this scheme and host rather than file://. */
export const appScheme = 'tallyline';
export const appOrigin = `${appScheme}://app`;

export function isAppUrl(url: string): boolean {
  return url === appOrigin || url.startsWith(`${appOrigin}/`);
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
