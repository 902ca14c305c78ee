#!/usr/bin/env node
// Playwright's webServer: the built app on a fresh PGlite directory with the demo team.
import { spawn } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";

const dir = process.env.PGLITE_DIR || fs.mkdtempSync(path.join(os.tmpdir(), "sensewright-e2e-"));
const port = process.env.PORT || "3210";
console.log(`[serve-test] PGLITE_DIR=${dir} PORT=${port}`);
// Same process group as this script, so Playwright's shutdown of the group ends the server too.
const server = spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-p", port], {
  stdio: "inherit",
  env: { ...process.env, PGLITE_DIR: dir, PORT: port, SEED_DEMO: "1", NEXTAUTH_URL: `http://localhost:${port}` },
});
const stop = () => {
  try {
    server.kill("SIGTERM");
  } catch {
    /* gone */
  }
};
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
server.on("exit", (code) => {
  if (!process.env.PGLITE_DIR) fs.rmSync(dir, { recursive: true, force: true });
  process.exit(code ?? 0);
});
