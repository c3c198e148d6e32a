import { APP_URL } from 'astro:env/server';

/**
 * Where links in e-mail point: APP_URL when the deployment sets it, else the origin the request came in
 * on. Astro builds that origin only from a Host header listed in security.allowedDomains, so a forged
 * Host cannot plant another site's address in a reset link.
 */
export function linkOrigin(requestUrl: URL): string {
  return APP_URL ? new URL(APP_URL).origin : requestUrl.origin;
}
