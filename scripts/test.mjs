#!/usr/bin/env node
// `npm test`: unit and database tests (Vitest), a production build, then HTTP and browser tests
// (Playwright, Debian's Chromium). Ends with one line: "N passed, N failed".
// First it checks the system tools the suites need (scripts/system-tools.mjs): installs them when
// root with apt-get, otherwise stops before running anything with the command to type.
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { ensureSystemTools } from "./system-tools.mjs";

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), "..");
process.chdir(root);
const out = path.join(root, "test-results");
fs.mkdirSync(out, { recursive: true });
// node scripts/test.mjs [unit|e2e] [--no-build] [playwright files…]
const args = process.argv.slice(2);
const only = args[0] === "unit" || args[0] === "e2e" ? args.shift() : undefined;
const noBuild = args.includes("--no-build");
const files = args.filter((a) => a !== "--no-build");

const totals = { passed: 0, failed: 0, skipped: 0 };
const suites = only ? [only] : ["unit", "e2e"];
if (!ensureSystemTools(suites, { install: true, tag: "[test]" })) {
  fs.writeFileSync(path.join(out, "totals.json"), JSON.stringify({ passed: 0, failed: 1, skipped: 0 }));
  console.log("\n0 passed, 1 failed");
  process.exit(1);
}
const run = (cmd, args, env = {}) =>
  spawnSync(cmd, args, { stdio: "inherit", env: { ...process.env, ...env } }).status ?? 1;

function readJson(file) {
  try {
    return JSON.parse(fs.readFileSync(file, "utf8"));
  } catch {
    return null;
  }
}

if (only !== "e2e") {
  const file = path.join(out, "vitest.json");
  fs.rmSync(file, { force: true });
  const status = run("npx", ["vitest", "run", "--reporter=default", "--reporter=json", `--outputFile=${file}`]);
  const report = readJson(file);
  if (report) {
    totals.passed += report.numPassedTests ?? 0;
    totals.failed += report.numFailedTests ?? 0;
    // A file that fails to load has no failed tests of its own; an unhandled error fails the run too.
    if (status !== 0 && !report.numFailedTests) totals.failed += Math.max(1, report.numFailedTestSuites ?? 0);
    totals.skipped += (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0);
  } else if (status !== 0) totals.failed += 1;
}

if (only !== "unit") {
  console.log("\n[test] building the app for the HTTP and browser tests…");
  if (!noBuild && run("npx", ["next", "build"]) !== 0) {
    totals.failed += 1;
  } else {
    const file = path.join(out, "playwright.json");
    fs.rmSync(file, { force: true });
    const status = run("npx", ["playwright", "test", "--reporter=list,json", ...files], {
      PLAYWRIGHT_JSON_OUTPUT_NAME: file,
    });
    const report = readJson(file);
    if (report?.stats) {
      totals.passed += report.stats.expected ?? 0;
      totals.failed += (report.stats.unexpected ?? 0) + (report.stats.flaky ?? 0);
      totals.skipped += report.stats.skipped ?? 0;
      if (status !== 0 && !report.stats.unexpected) totals.failed += report.errors?.length ? report.errors.length : 1;
    } else if (status !== 0) totals.failed += 1;
  }
}

fs.writeFileSync(path.join(out, "totals.json"), JSON.stringify(totals));
console.log(`\n${totals.passed} passed, ${totals.failed} failed${totals.skipped ? `, ${totals.skipped} skipped` : ""}`);
process.exit(totals.failed > 0 ? 1 : 0);
