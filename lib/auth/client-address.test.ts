// The address sign-in throttling counts by: the socket's own peer unless TRUST_PROXY=1, and then the
// entry the proxy appended (the last one) of X-Forwarded-For (the header's usual meaning; common
// practice, no source).
import http from "node:http";
import type { AddressInfo } from "node:net";
import { afterEach, describe, expect, it, vi } from "vitest";

async function load(trustProxy: string | undefined) {
  vi.resetModules();
  vi.stubEnv("TRUST_PROXY", trustProxy ?? "");
  return import("./client-address");
}

/** Sends one request with `headers` to a real server; returns the headers the server saw. */
async function seenBy(headers: Record<string, string>): Promise<http.IncomingHttpHeaders> {
  let seen: http.IncomingHttpHeaders = {};
  const server = http.createServer((req, res) => {
    seen = req.headers;
    res.end();
  });
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  const { port } = server.address() as AddressInfo;
  await fetch(`http://127.0.0.1:${port}/`, { headers });
  await new Promise<void>((r) => server.close(() => r()));
  return seen;
}

afterEach(() => vi.unstubAllEnvs());

describe("clientAddress", () => {
  it("ignores X-Forwarded-For without TRUST_PROXY and uses the socket's peer, which a client cannot forge", async () => {
    const { clientAddress, stampPeerAddresses } = await load(undefined);
    stampPeerAddresses();
    const seen = await seenBy({ "X-Forwarded-For": "203.0.113.9", "x-sensewright-peer": "198.51.100.1" });
    expect(clientAddress(seen as Record<string, unknown>)).toBe("127.0.0.1");
  });

  it("takes the last X-Forwarded-For entry with TRUST_PROXY=1", async () => {
    const { clientAddress } = await load("1");
    expect(clientAddress(new Headers({ "x-forwarded-for": "203.0.113.9, 192.0.2.44" }))).toBe("192.0.2.44");
    expect(clientAddress({ "x-forwarded-for": "192.0.2.45" })).toBe("192.0.2.45");
  });
});
