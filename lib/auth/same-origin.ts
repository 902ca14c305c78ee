// Cross-site request refusal (issue 10, item 4), applied by the gate to every state-changing call.
// A browser names the page that made a request in `Origin` (on every POST, PUT, PATCH and DELETE)
// and, in current browsers, says in `Sec-Fetch-Site` whether that page is on another site. A
// request from another origin would act with the victim's session cookie, so it gets 403.
//
// The app's own origin is any of:
//   - the origin the request was addressed to: its Host header (what the browser put in the
//     address bar), compared as host and port with the Origin's host and port;
//   - PUBLIC_URL and NEXTAUTH_URL, when set (the address behind a reverse proxy that rewrites Host).
// A request with no Origin and no Sec-Fetch-Site comes from a script or a tool, not from a page in
// a browser, so there is no victim whose cookie rides along; it passes. A request with
// `Authorization: Bearer …` carries its own credential instead of a cookie and is not checked (a
// page on another site cannot add that header without a CORS preflight, which the app never grants).
import { HttpError } from "@/lib/http";

const STATE_CHANGING = new Set(["POST", "PUT", "PATCH", "DELETE"]);

function originOf(url: string | undefined): string | null {
  if (!url) return null;
  try {
    return new URL(url).origin;
  } catch {
    return null;
  }
}

/** The configured addresses of the app (PUBLIC_URL, NEXTAUTH_URL), as origins. */
function configuredOrigins(): string[] {
  return [process.env.PUBLIC_URL, process.env.NEXTAUTH_URL].map(originOf).filter((o): o is string => o !== null);
}

/** Why the request is refused as cross-site, or null when it may go on. */
export function crossSiteReason(request: Request): string | null {
  if (!STATE_CHANGING.has(request.method.toUpperCase())) return null;
  if (/^bearer\s/i.test(request.headers.get("authorization") ?? "")) return null;
  const fetchSite = request.headers.get("sec-fetch-site")?.toLowerCase();
  if (fetchSite === "cross-site") return "the browser says the request comes from another site";
  const origin = request.headers.get("origin");
  if (origin === null) return null;
  let parsed: URL;
  try {
    parsed = new URL(origin);
  } catch {
    return `its Origin "${origin.slice(0, 80)}" is not an address of this app`;
  }
  if (parsed.origin === "null") return 'its Origin is "null" (a sandboxed or privacy-restricted page)';
  const host = request.headers.get("host")?.toLowerCase();
  if (host && parsed.host.toLowerCase() === host) return null;
  if (configuredOrigins().includes(parsed.origin)) return null;
  return `it comes from ${parsed.origin}, which is not this app`;
}

/** 403 for a state-changing request made by a page on another origin. */
export function assertSameOrigin(request: Request): void {
  const why = crossSiteReason(request);
  if (why)
    throw new HttpError(
      403,
      `Refused: ${why}. Changes are accepted only from this app's own pages; nothing was changed.`,
    );
}
