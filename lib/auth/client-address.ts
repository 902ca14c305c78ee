// The address a request came from, for sign-in throttling. Next's server fills X-Forwarded-For from
// the socket only when the client sent none, so without a trusted proxy that header is whatever the
// client says. We therefore stamp the socket's peer address on every incoming request under a header
// name drawn at random per process (a client cannot guess it, so cannot forge it), and read
// X-Forwarded-For only when TRUST_PROXY=1 says a reverse proxy in front of the app sets it.
import { randomBytes } from "node:crypto";
import diagnostics from "node:diagnostics_channel";
import type { IncomingMessage } from "node:http";
import type { Socket } from "node:net";
import { env } from "@/lib/env";

const key = Symbol.for("sensewright.peerHeader");
type G = typeof globalThis & { [key]?: string };
const g = globalThis as G;

/** Stamps each request with its socket's peer address; call once at server start. */
export function stampPeerAddresses(): void {
  if (g[key]) return;
  const header = `x-sensewright-peer-${randomBytes(8).toString("hex")}`;
  g[key] = header;
  // Node publishes this before the server's "request" event, i.e. before Next reads the headers.
  diagnostics.subscribe("http.server.request.start", (message) => {
    const { request, socket } = message as { request: IncomingMessage; socket: Socket };
    request.headers[header] = socket.remoteAddress ?? "unknown";
  });
}

type HeaderSource = Headers | Record<string, unknown> | undefined;

function header(headers: HeaderSource, name: string): string | undefined {
  if (!headers) return undefined;
  if (headers instanceof Headers) return headers.get(name) ?? undefined;
  const value = headers[name];
  return typeof value === "string" ? value : Array.isArray(value) ? String(value.at(-1)) : undefined;
}

/**
 * The client's address. With TRUST_PROXY=1, the last X-Forwarded-For entry (the one the proxy in front
 * appended; earlier entries are the client's own claims). Otherwise the socket's peer address.
 */
export function clientAddress(headers: HeaderSource): string {
  if (env().TRUST_PROXY === "1") {
    const forwarded = header(headers, "x-forwarded-for")?.split(",").at(-1)?.trim();
    if (forwarded) return forwarded.slice(0, 100);
  }
  const peer = g[key] ? header(headers, g[key]) : undefined;
  return (peer ?? "unknown").replace(/^::ffff:/, "").slice(0, 100);
}
