// Redirect targets resolved as a browser resolves them (WHATWG URL, which Node implements): a
// backslash after the slash, a tab or "//" makes a host, so those must fall back.
import { describe, expect, it } from "vitest";
import { safeNextPath, safeRedirectUrl } from "./safe-redirect";

describe("safeNextPath", () => {
  it("keeps paths on the app", () => {
    expect(safeNextPath("/designs/abc?tab=review#c1")).toBe("/designs/abc?tab=review#c1");
    expect(safeNextPath("/invitations/tok_en-1")).toBe("/invitations/tok_en-1");
  });

  it.each([
    "/\\evil.example",
    "/%5Cevil.example".replace("%5C", "\\"),
    "//evil.example",
    "/\t/evil.example",
    "/.//evil.example",
    "https://evil.example/designs",
    "javascript:alert(1)",
    "\\\\evil.example",
  ])("refuses %j", (raw) => {
    expect(safeNextPath(raw)).toBe("/designs");
  });

  it("keeps an escaped backslash as a harmless path on the app", () => {
    // Undecoded, "%5C" is just a character of a path on our own host.
    expect(safeNextPath("/%5Cevil.example")).toBe("/%5Cevil.example");
  });

  it("falls back on nothing, junk and overlong values", () => {
    expect(safeNextPath(undefined)).toBe("/designs");
    expect(safeNextPath("")).toBe("/designs");
    expect(safeNextPath(`/${"a".repeat(3000)}`)).toBe("/designs");
  });
});

describe("safeRedirectUrl", () => {
  const base = "http://localhost:3000";
  it("keeps same-origin targets, absolute or relative", () => {
    expect(safeRedirectUrl("/compare?ids=a,b", base)).toBe("http://localhost:3000/compare?ids=a,b");
    expect(safeRedirectUrl("http://localhost:3000/library", base)).toBe("http://localhost:3000/library");
  });

  it("sends other origins and malformed URLs home without throwing", () => {
    expect(safeRedirectUrl("http://localhost:99999/", base)).toBe("http://localhost:3000/designs");
    expect(safeRedirectUrl("http://localhost:3001/designs", base)).toBe("http://localhost:3000/designs");
    expect(safeRedirectUrl("/\\evil.example", base)).toBe("http://localhost:3000/designs");
    expect(safeRedirectUrl("/designs", "not a url")).toBe("/designs");
  });
});
