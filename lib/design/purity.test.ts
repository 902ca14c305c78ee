// The engine must run in a browser worker as well as on the server: its non-test files may
// import only mathjs, zod and each other (house style; docs/architecture.md).
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";

const dir = __dirname;
const sources = readdirSync(dir).filter((f) => f.endsWith(".ts") && !f.endsWith(".test.ts"));

describe("lib/design stays pure", () => {
  it("has source files to check", () => {
    expect(sources).toContain("index.ts");
  });
  it.each(sources)("%s imports only mathjs, zod and ./ files", (file) => {
    const text = readFileSync(join(dir, file), "utf8");
    const specifiers = [...text.matchAll(/(?:import|export)[^'"]*?from\s+["']([^"']+)["']/g)].map((m) => m[1]);
    for (const s of specifiers) expect(s === "mathjs" || s === "zod" || s?.startsWith("./")).toBe(true);
    expect(text).not.toMatch(/\brequire\(|process\.|from ["']node:/);
  });
});
