// For bench sections that need the built app in a browser: start it (scripts/serve-test.mjs) on
// its own port and a temporary database, launch Chromium, sign in as a demo user, and stop it all.
// Build first (`npx next build`, or with NEXT_DIST_DIR). Lives outside scripts/bench/ because every
// file there is a section.
import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { chromium, type Browser, type Page } from "@playwright/test";

export type BenchApp = { base: string; browser: Browser; stop: () => Promise<void> };

async function waitForHealth(server: ChildProcess, base: string, timeoutMs = 90_000) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (server.exitCode !== null) throw new Error(`the app exited with ${server.exitCode} before it was ready`);
    try {
      const res = await fetch(`${base}/api/health`);
      if (res.ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`the app did not answer on ${base} within ${timeoutMs / 1000} s`);
}

export async function startBenchApp(port: number): Promise<BenchApp> {
  const base = `http://localhost:${port}`;
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), "sensewright-bench-"));
  const server = spawn(process.execPath, ["scripts/serve-test.mjs"], {
    env: { ...process.env, PORT: String(port), PGLITE_DIR: dataDir },
    stdio: "ignore",
    detached: true,
  });
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    args: [
      "--no-sandbox",
      "--disable-dev-shm-usage",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      "--disable-default-apps",
      "--disable-extensions",
      "--no-first-run",
      "--no-default-browser-check",
    ],
  });
  const stop = async () => {
    await browser.close();
    try {
      if (server.pid) process.kill(-server.pid, "SIGTERM");
    } catch {
      /* already gone */
    }
    await new Promise((r) => setTimeout(r, 500));
    fs.rmSync(dataDir, { recursive: true, force: true });
  };
  try {
    await waitForHealth(server, base);
  } catch (e) {
    await stop();
    throw e;
  }
  return { base, browser, stop };
}

export async function signIn(page: Page, base: string, email = "designer@harbourline.example") {
  await page.goto(`${base}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill("sensewright-demo");
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.getByTestId("current-role").waitFor();
}
