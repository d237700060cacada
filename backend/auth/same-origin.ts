/**
 * Cross-site request forgery check for writes that ride on the session cookie. SameSite=Strict
 * already withholds the cookie from other sites; this is the second wall (OWASP CSRF Prevention
 * Cheat Sheet, "Verifying Origin with standard headers"; Fetch Metadata, Sec-Fetch-Site).
 *
 * Pure and total: whatever the headers hold, it answers and never throws.
 */

/** Methods that change nothing: a cross-site GET cannot write. */
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

export interface CookieWrite {
  method: string;
  /** The Origin header as received (undefined when absent). */
  origin: string | undefined;
  /** The Sec-Fetch-Site header as received (undefined when absent). */
  secFetchSite: string | undefined;
  /** The origins this service answers on, as URLs (only their scheme, host and port count). */
  expected: ReadonlyArray<string | undefined>;
}

/**
 * `scheme://host[:port]` of a URL, lower-cased with the default port dropped (WHATWG URL), or
 * undefined for anything that is not an absolute http(s) URL.
 */
export function originOf(url: string | undefined): string | undefined {
  if (!url) return undefined;
  try {
    const parsed = new URL(url);
    if (parsed.protocol !== 'http:' && parsed.protocol !== 'https:') return undefined;
    return parsed.origin;
  } catch {
    return undefined;
  }
}

/**
 * Why a cookie-authenticated request must be refused, or null when it may go on. A safe method
 * always goes on. A write needs an Origin that is exactly one of the expected origins (scheme, host
 * and port); `Origin: null` (sandboxed frames, some redirects, file:// pages) and a malformed one
 * are refused. Browsers send Origin on every POST, PUT, PATCH and DELETE; a write without one is
 * refused unless Sec-Fetch-Site says same-origin. Sec-Fetch-Site: cross-site is refused whatever
 * the Origin says.
 */
export function crossSiteWriteRefusal(write: CookieWrite): string | null {
  if (SAFE_METHODS.has(String(write.method).toUpperCase())) return null;
  const site = write.secFetchSite?.trim().toLowerCase();
  if (site === 'cross-site') return 'The browser says this write came from another site.';
  const origin = write.origin?.trim();
  if (origin === undefined || origin === '') {
    return site === 'same-origin'
      ? null
      : 'A write with the session cookie needs an Origin header.';
  }
  if (origin.toLowerCase() === 'null') return 'A write from an opaque origin (Origin: null).';
  // An Origin header is a bare serialized origin: no path, query, fragment or credentials.
  const received = originOf(origin);
  if (received === undefined || received !== origin.toLowerCase())
    return 'The Origin header is not a valid origin.';
  const allowed = write.expected.map(originOf).filter((o): o is string => o !== undefined);
  return allowed.includes(received) ? null : `A write from ${received} was refused.`;
}
