// Where a `next` or `callbackUrl` may send someone: only somewhere on the app's own origin. Browsers
// read "/\evil.example", "/\t/evil.example" and "//evil.example" as another host, so the value is
// resolved the way a browser would and kept only when it stays home. Never throws.

const HOME = "http://app.invalid";

/** A same-origin path ("/designs?x=1#y") for `raw`, or `fallback` when it would leave the app. */
export function safeNextPath(raw: string | null | undefined, fallback = "/designs"): string {
  if (!raw || typeof raw !== "string" || raw.length > 2000) return fallback;
  let url: URL;
  try {
    url = new URL(raw, HOME);
  } catch {
    return fallback;
  }
  if (url.origin !== HOME) return fallback;
  const path = `${url.pathname}${url.search}${url.hash}`;
  // "/.//evil.example" resolves to the path "//evil.example", which a browser reads as a host.
  return path.startsWith("//") ? fallback : path;
}

/**
 * For next-auth's redirect callback: an absolute URL on `baseUrl`'s origin. `url` may be a path or an
 * absolute URL; anything else, malformed ones included (a port of 99999), goes to `baseUrl` + fallback.
 */
export function safeRedirectUrl(url: string, baseUrl: string, fallback = "/designs"): string {
  let base: URL;
  try {
    base = new URL(baseUrl);
  } catch {
    return fallback;
  }
  let target: URL | null = null;
  try {
    target = new URL(url, base);
  } catch {
    target = null;
  }
  const path =
    target && target.origin === base.origin
      ? safeNextPath(target.pathname + target.search + target.hash, fallback)
      : fallback;
  return new URL(path, base).toString();
}
