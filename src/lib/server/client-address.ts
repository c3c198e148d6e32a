import { TRUST_PROXY } from 'astro:env/server';

/** The caller's address for rate limiting; X-Forwarded-For only when a trusted proxy sets it. */
export function clientAddress(request: Request, socketAddress: () => string): string {
  if (TRUST_PROXY) {
    const forwarded = request.headers.get('x-forwarded-for')?.split(',')[0]?.trim();
    if (forwarded) return forwarded;
  }
  try {
    return socketAddress();
  } catch {
    return 'unknown';
  }
}
