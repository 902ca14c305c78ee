// Physics lives in lib/design (house style; docs/architecture.md): screens, routes, the build
// sheet and the database layer call the engine for a figure and never work one out. This scan
// holds the commonest slip, Ohm's and Joule's laws done on the spot: a product with a current
// among its factors and a resistance among the others (I·R, I²·R, I·I·R).
//
// The files are parsed with the TypeScript compiler, not read as lines, so a product is found
// however it is spelled: `a * b * c` chains and `x *= r` are flattened into their factors, and a
// factor seen through parentheses, `!`, `as`, unary minus, `Math.abs(x)`, `x ** 2` or
// `Math.pow(x, 2)` is x; a parenthesised sum or difference is a resistance when one of its terms
// is (`i * (shuntOhms + ron)`). Comments and strings are never code, so they never count.
//
// A factor is classed by its name (an identifier, or the last name of a property path):
// - a current: a name with "current" or "amps" in it; ending in "A" after a lower-case letter
//   (currentA, peakA, maxA) or in "Amps"/"Current"; `i` or `I` alone or followed by a capital,
//   digit or underscore (iMax, I0, i_load);
// - a resistance: a name with "ohm", "shunt", "resist" or "impedance" in it; `r` or `R` alone or
//   followed by a capital, digit or underscore (rSense, R1, r_s); `rs`, `Rs`, `ron`, `Ron`;
//   ending in "R" after a lower-case letter (senseR).
// - a bound of either (min, max, typical, peak, nominal: `req.current.max`, `r.resistance.min`) is
//   what its owner is.
// It misses arithmetic spelled through a helper of the app's own or on literals.
//
// One file is let off, by name and reason: the engine bench's hand-written baseline loop, which
// copies the engine's arithmetic on purpose to measure the engine against it and shows no one a
// figure.
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import ts from "typescript";
import { describe, expect, it } from "vitest";

const ROOT = path.resolve(__dirname, "../..");
const SCANNED = ["app", "components", "lib", "db", "scripts"];
const SKIP_DIRS = new Set(["node_modules", ".next", "migrations"]);
const ENGINE = path.join(ROOT, "lib", "design");
const LET_OFF: Record<string, string> = {
  "scripts/bench/engine.ts": "baselineSweep: the hand-written copy of the sweep that the engine is timed against",
};
const BOUNDS = new Set(["min", "max", "typical", "peak", "nominal"]);

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) {
      if (SKIP_DIRS.has(name) || name.startsWith(".next") || full === ENGINE) return [];
      return sourceFiles(full);
    }
    return /\.(tsx?|mts|mjs)$/.test(name) && !/\.test\.tsx?$/.test(name) ? [full] : [];
  });
}

export function isCurrentName(name: string): boolean {
  return /current|amps/i.test(name) || /[a-z]A$|Amps?$/.test(name) || /^[iI](?:$|[A-Z0-9_])/.test(name);
}

export function isResistanceName(name: string): boolean {
  return (
    /ohm|shunt|resist|impedance/i.test(name) ||
    /^[rR](?:$|[A-Z0-9_])/.test(name) ||
    /^(?:rs|Rs|ron|Ron)$/.test(name) ||
    /[a-z]R$/.test(name)
  );
}

type Kind = "current" | "resistance" | null;

/** What one factor of a product stands for, looked at through the wrappers that keep its dimension. */
function kindOf(node: ts.Expression): Kind {
  if (ts.isParenthesizedExpression(node) || ts.isNonNullExpression(node) || ts.isAsExpression(node))
    return kindOf(node.expression);
  if (ts.isPrefixUnaryExpression(node) && node.operator === ts.SyntaxKind.MinusToken) return kindOf(node.operand);
  if (ts.isBinaryExpression(node)) {
    const op = node.operatorToken.kind;
    if (op === ts.SyntaxKind.AsteriskAsteriskToken) return kindOf(node.left);
    if (op === ts.SyntaxKind.PlusToken || op === ts.SyntaxKind.MinusToken) {
      const kinds = [kindOf(node.left), kindOf(node.right)];
      if (kinds.includes("resistance")) return "resistance";
      if (kinds.includes("current")) return "current";
    }
    return null;
  }
  if (ts.isCallExpression(node)) {
    const callee = node.expression.getText();
    if ((callee === "Math.pow" || callee === "Math.abs") && node.arguments[0]) return kindOf(node.arguments[0]);
    return null;
  }
  let name: string | null = null;
  if (ts.isIdentifier(node)) name = node.text;
  else if (ts.isPropertyAccessExpression(node)) {
    name = node.name.text;
    if (BOUNDS.has(name)) return kindOf(node.expression);
  } else if (ts.isElementAccessExpression(node) && ts.isStringLiteralLike(node.argumentExpression))
    name = node.argumentExpression.text;
  if (name === null) return null;
  if (isResistanceName(name)) return "resistance";
  if (isCurrentName(name)) return "current";
  return null;
}

const isTimes = (n: ts.Node): n is ts.BinaryExpression =>
  ts.isBinaryExpression(n) &&
  (n.operatorToken.kind === ts.SyntaxKind.AsteriskToken || n.operatorToken.kind === ts.SyntaxKind.AsteriskEqualsToken);

/** The factors of a product chain: a * b * (c * d) → a, b, c, d. */
function factorsOf(node: ts.Expression): ts.Expression[] {
  const inner = ts.isParenthesizedExpression(node) ? node.expression : node;
  if (isTimes(inner)) return [...factorsOf(inner.left), ...factorsOf(inner.right)];
  return [node];
}

/** Every product in `source` with a current and a resistance among its factors, as written. */
export function ohmsLawProducts(source: string, fileName = "x.tsx"): string[] {
  const file = ts.createSourceFile(fileName, source, ts.ScriptTarget.Latest, true, ts.ScriptKind.TSX);
  const out: string[] = [];
  const visit = (node: ts.Node) => {
    // The top of a chain only: its parent is not itself a product (through parentheses).
    let up = node.parent;
    while (up && ts.isParenthesizedExpression(up)) up = up.parent;
    if (isTimes(node) && !(up && isTimes(up))) {
      const kinds = factorsOf(node).map(kindOf);
      if (kinds.includes("current") && kinds.includes("resistance")) out.push(node.getText(file));
      else node.forEachChild(visit);
      return;
    }
    node.forEachChild(visit);
  };
  visit(file);
  return out;
}

describe("the scan", () => {
  it("finds Ohm's law spelled the usual ways", () => {
    expect(ohmsLawProducts("const v = peak.currentA * design.shuntOhms;")).toHaveLength(1);
    expect(ohmsLawProducts("x = d.shuntOhms * i;")).toHaveLength(1);
    expect(ohmsLawProducts("v = req.current.max * choice.shuntOhms")).toHaveLength(1);
    expect(ohmsLawProducts("v = samples[k]!.currentA * r.resistanceOhms")).toHaveLength(1);
  });
  it("finds Joule's law and products of three", () => {
    expect(ohmsLawProducts("const p = I * I * R;")).toEqual(["I * I * R"]);
    expect(ohmsLawProducts("const p = current ** 2 * r;")).toEqual(["current ** 2 * r"]);
    expect(ohmsLawProducts("const p = Math.pow(i, 2) * r;")).toEqual(["Math.pow(i, 2) * r"]);
    expect(ohmsLawProducts("const p = 0.5 * (peakA) ** 2 * senseR;")).toHaveLength(1);
    expect(ohmsLawProducts("const p = r * (i * i);")).toEqual(["r * (i * i)"]);
  });
  it("finds i·r under other names and through wrappers", () => {
    expect(ohmsLawProducts("const v = iMax * rSense;")).toHaveLength(1);
    expect(ohmsLawProducts("const v = req.current.max * x.resistance.min;")).toHaveLength(1);
    expect(ohmsLawProducts("const v = loadAmps * R1;")).toHaveLength(1);
    expect(ohmsLawProducts("const v = -Math.abs(i_load) * (rs + ron);")).toHaveLength(1);
    expect(ohmsLawProducts("const v = (x.maxA as number) * d['shuntOhms'];")).toHaveLength(1);
    expect(ohmsLawProducts("let v = 0; v *= gain; drawnAmps *= pathImpedance;")).toEqual([
      "drawnAmps *= pathImpedance",
    ]);
    expect(ohmsLawProducts("const s = `${formatSI(peakA * shuntOhms, 'V')}`;")).toHaveLength(1);
  });
  it("leaves other products, comments and strings alone", () => {
    expect(ohmsLawProducts("const w = width * scale; // I * shuntOhms in a comment")).toEqual([]);
    expect(ohmsLawProducts("// burden = currentA * shuntOhms")).toEqual([]);
    expect(ohmsLawProducts("/* p = I * I * R */ const c = capacityMah * 3.6;")).toEqual([]);
    expect(ohmsLawProducts("const s = 'currentA * shuntOhms';")).toEqual([]);
    expect(ohmsLawProducts("const x = index * radius + item * row;")).toEqual([]);
    expect(ohmsLawProducts("const t = currentA * 1000; const g = gain * shuntOhms;")).toEqual([]);
    expect(ohmsLawProducts("const w = bar.max * shuntOhms; const y = axis.min * peakA;")).toEqual([]);
  });
});

describe("no physics outside lib/design", () => {
  const files = SCANNED.flatMap((d) => sourceFiles(path.join(ROOT, d)));

  it("scans the app, its components, libraries, database layer and scripts", () => {
    expect(files.length).toBeGreaterThan(50);
    expect(files.some((f) => f.includes(path.join("components", "profile")))).toBe(true);
    expect(files.some((f) => f.includes(path.join("components", "design", "")))).toBe(true);
    expect(files.some((f) => f.includes(path.join("lib", "build-sheet")))).toBe(true);
    expect(files.some((f) => f.startsWith(ENGINE + path.sep))).toBe(false);
  });

  it("no file outside the engine multiplies a current by a resistance", () => {
    const found = files
      .map((f) => ({ file: path.relative(ROOT, f), products: ohmsLawProducts(readFileSync(f, "utf8"), f) }))
      .filter((x) => x.products.length > 0 && !(x.file in LET_OFF));
    expect(found).toEqual([]);
  });

  it("lets off only files that exist and still need it", () => {
    for (const file of Object.keys(LET_OFF))
      expect(ohmsLawProducts(readFileSync(path.join(ROOT, file), "utf8"), file).length, file).toBeGreaterThan(0);
  });
});
