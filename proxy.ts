// Next's proxy, for one job only: a path with a malformed percent-escape (/api/designs/%ZZ) fails
// Next's own parameter decoding and ends as a bare 500, so it is answered here first: 400 JSON for
// the API, a plain 400 for pages. The matcher sends only paths that hold a "%" through this (Next
// buffers the body of a request it hands to the proxy, so nothing else should come here).
import { NextResponse, type NextRequest } from "next/server";

const MESSAGE = "The address holds a malformed percent-escape (a % not followed by the code of a character).";

export function proxy(request: NextRequest) {
  const rawPath = new URL(request.url).pathname;
  try {
    decodeURIComponent(rawPath);
    return NextResponse.next();
  } catch {
    if (rawPath.startsWith("/api/"))
      return NextResponse.json({ message: MESSAGE }, { status: 400, headers: { "cache-control": "no-store" } });
    return new NextResponse(MESSAGE, { status: 400, headers: { "content-type": "text/plain; charset=utf-8" } });
  }
}

export const config = {
  matcher: ["/:path(.*%.*)"],
};
