#!/usr/bin/env node
// `npm start`: builds when the sources are newer than the last build, then serves on PORT (3000)
// with the demo team loaded into an empty PGlite database.
import { spawn, spawnSync } from "node:child_process";
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

const builtAt = fs.existsSync(buildId) ? fs.statSync(buildId).mtimeMs : 0;
const changedAt = Math.max(...sources.map(newest));
if (changedAt > builtAt) {
  console.log(builtAt ? "[start] sources changed since the last build: building…" : "[start] first start: building…");
  const build = spawnSync("npx", ["next", "build"], { stdio: "inherit" });
  if (build.status !== 0) process.exit(build.status ?? 1);
}

const env = { ...process.env, SEED_DEMO: process.env.SEED_DEMO ?? "1" };
const port = env.PORT ?? "3000";
const server = spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-p", port], {
  stdio: "inherit",
  env,
});
const stop = (signal) => {
  try {
    server.kill(signal);
  } catch {
    /* already gone */
  }
};
process.on("SIGINT", () => stop("SIGINT"));
process.on("SIGTERM", () => stop("SIGTERM"));
server.on("exit", (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
