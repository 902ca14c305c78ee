// Physics lives in lib/design (house style; docs/architecture.md): screens, routes, the build
// sheet and the database layer call the engine for a figure and never work one out. This scan
// holds the commonest slip, Ohm's law done on the spot: a product whose one side names a current
// and whose other side names a resistance.
//
// The heuristic: in every .ts/.tsx file outside lib/design (tests and node_modules aside), each
// `a * b` whose operands are identifiers or property paths; a current is a name containing
// "current" or "amps", ending in "A" after a lower-case letter (currentA, peakA), or `i`/`I`; a
// resistance is a name containing "ohm", "shunt" or "resist". It misses arithmetic spelled
// another way (a helper, a literal); it does not flag units that merely sit on the same line.
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

const ROOT = path.resolve(__dirname, "../..");
const SCANNED = ["app", "components", "lib", "db", "scripts"];
const SKIP_DIRS = new Set(["node_modules", ".next", "migrations"]);
const ENGINE = path.join(ROOT, "lib", "design");

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) {
      if (SKIP_DIRS.has(name) || full === ENGINE) return [];
      return sourceFiles(full);
    }
    return /\.tsx?$/.test(name) && !/\.test\.tsx?$/.test(name) ? [full] : [];
  });
}

const operand = String.raw`[A-Za-z_$][\w$]*(?:(?:\?\.|\.)[A-Za-z_$][\w$]*|\[[^\]]*\]|!)*`;
const product = new RegExp(`(${operand})\\s*\\*\\s*(${operand})`, "g");
const lastName = (expr: string) =>
  expr
    .replace(/!|\[[^\]]*\]/g, "")
    .split(/\?\.|\./)
    .pop() ?? "";

export function isCurrent(expr: string): boolean {
  const name = lastName(expr);
  return /current|amps?/i.test(expr) || /[a-z]A$/.test(name) || name === "i" || name === "I";
}
export function isResistance(expr: string): boolean {
  return /ohm|shunt|resist/i.test(lastName(expr)) || /shunt/i.test(expr);
}

export function ohmsLawProducts(source: string): string[] {
  const out: string[] = [];
  for (const line of source.split("\n")) {
    if (/^\s*(\/\/|\*|\/\*)/.test(line)) continue; // comments may explain I·R
    for (const m of line.replace(/\s\/\/\s.*$/, "").matchAll(product)) {
      const [a, b] = [m[1] ?? "", m[2] ?? ""];
      if ((isCurrent(a) && isResistance(b)) || (isResistance(a) && isCurrent(b))) out.push(m[0]);
    }
  }
  return out;
}

describe("the heuristic", () => {
  it("finds Ohm's law spelled the usual ways", () => {
    expect(ohmsLawProducts("const v = peak.currentA * design.shuntOhms;")).toHaveLength(1);
    expect(ohmsLawProducts("x = d.shuntOhms * i;")).toHaveLength(1);
    expect(ohmsLawProducts("v = req.current.max * choice.shuntOhms")).toHaveLength(1);
    expect(ohmsLawProducts("v = samples[k]!.currentA * r.resistanceOhms")).toHaveLength(1);
  });
  it("leaves other products and comments alone", () => {
    expect(ohmsLawProducts("const w = width * scale; // I * shuntOhms in a comment")).toEqual([]);
    expect(ohmsLawProducts("// burden = currentA * shuntOhms")).toEqual([]);
    expect(ohmsLawProducts("const c = capacityMah * 3.6;")).toEqual([]);
  });
});

describe("no physics outside lib/design", () => {
  const files = SCANNED.flatMap((d) => sourceFiles(path.join(ROOT, d)));

  it("scans the app, its components, libraries, database layer and scripts", () => {
    expect(files.length).toBeGreaterThan(50);
    expect(files.some((f) => f.includes(path.join("components", "profile")))).toBe(true);
    expect(files.some((f) => f.includes(path.join("components", "design", "")))).toBe(true);
    expect(files.some((f) => f.startsWith(ENGINE + path.sep))).toBe(false);
  });

  it("no file outside the engine multiplies a current by a resistance", () => {
    const found = files
      .map((f) => ({ file: path.relative(ROOT, f), products: ohmsLawProducts(readFileSync(f, "utf8")) }))
      .filter((x) => x.products.length > 0);
    expect(found).toEqual([]);
  });
});
