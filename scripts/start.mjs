#!/usr/bin/env node
// `npm start`: builds when the sources are newer than the last build, then serves on PORT (3000)
// with the demo team loaded into an empty PGlite database. While it builds and until the server
// answers it prints one line every ten seconds, so a first start never looks hung.
import { spawn } from "node:child_process";
import fs from "node:fs";
import path from "node:path";

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), "..");
process.chdir(root);
const distDir = process.env.NEXT_DIST_DIR || ".next";
const buildId = path.join(distDir, "BUILD_ID");
const sources = [
  "app",
  "components",
  "lib",
  "db",
  "public",
  "instrumentation.ts",
  "next.config.ts",
  "tailwind.config.ts",
  "package-lock.json",
];

function newest(p) {
  if (!fs.existsSync(p)) return 0;
  const st = fs.statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  let max = st.mtimeMs;
  for (const entry of fs.readdirSync(p)) max = Math.max(max, newest(path.join(p, entry)));
  return max;
}

const env = { ...process.env, SEED_DEMO: process.env.SEED_DEMO ?? "1" };
const port = env.PORT ?? "3000";
const startedAt = Date.now();
let phase = "building";
const progress = setInterval(() => {
  const s = Math.round((Date.now() - startedAt) / 1000);
  console.log(`[start] ${phase}… ${s} s so far`);
}, 10_000);

let child = null;
const stop = (signal) => {
  try {
    child?.kill(signal);
  } catch {
    /* already gone */
  }
};
process.on("SIGINT", () => stop("SIGINT"));
process.on("SIGTERM", () => stop("SIGTERM"));

function build() {
  return new Promise((resolve) => {
    child = spawn("npx", ["next", "build"], { stdio: "inherit" });
    child.on("exit", (code) => resolve(code ?? 1));
  });
}

async function answers(url) {
  try {
    return (await fetch(url, { signal: AbortSignal.timeout(2000) })).ok;
  } catch {
    return false;
  }
}

const builtAt = fs.existsSync(buildId) ? fs.statSync(buildId).mtimeMs : 0;
const changedAt = Math.max(...sources.map(newest));
if (changedAt > builtAt) {
  console.log(
    builtAt
      ? "[start] sources changed since the last build: building…"
      : "[start] first start: building the app (a minute or more on two cores)…",
  );
  const code = await build();
  if (code !== 0) {
    clearInterval(progress);
    process.exit(code);
  }
}

phase = "starting the server";
const server = spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-p", port], {
  stdio: "inherit",
  env,
});
child = server;
server.on("exit", (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
const health = `http://localhost:${port}/api/health`;
while (!(await answers(health))) {
  if (server.exitCode !== null) break;
  await new Promise((r) => setTimeout(r, 500));
}
clearInterval(progress);
if (server.exitCode === null) console.log(`[start] ready at http://localhost:${port}`);
