// The README's worked scripts (examples/), run as a user would: against the test server with a
// personal token, through the real curl, jq and python3 of the machine.
import { execFile } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { expect, test } from "@playwright/test";
import { baseURL } from "../../playwright.config";
import { apiAs, type DemoRole } from "../fixtures/auth";

const run = promisify(execFile);

async function tokenOf(role: DemoRole, access: "read" | "write") {
  const ctx = await apiAs(role);
  const res = await ctx.post("/api/tokens", { data: { name: `example ${role}`, access } });
  expect(res.status(), await res.text()).toBe(201);
  const { token } = (await res.json()) as { token: string };
  return { ctx, token };
}

test("the curl script solves, saves and uploads with a designer's write token", async () => {
  const { ctx, token } = await tokenOf("designer", "write");
  const { stdout } = await run("bash", ["examples/solve-save-upload.sh"], {
    env: { ...process.env, SENSEWRIGHT_URL: baseURL, SENSEWRIGHT_TOKEN: token },
  });
  const id = /saved design ([0-9a-f-]{36})/.exec(stdout)?.[1];
  expect(id, stdout).toBeTruthy();
  expect(stdout).toMatch(/uploaded 10 samples/);
  const profiles = (await (await ctx.get(`/api/designs/${id}/profiles`)).json()) as { profiles: unknown[] };
  expect(profiles.profiles).toHaveLength(1);
  await ctx.dispose();
});

test("the curl script stops with the API's message when the token may not write", async () => {
  const { ctx, token } = await tokenOf("designer", "read");
  const failed = await run("bash", ["examples/solve-save-upload.sh"], {
    env: { ...process.env, SENSEWRIGHT_URL: baseURL, SENSEWRIGHT_TOKEN: token },
  }).catch((e: { code: number; stderr: string }) => e);
  expect("code" in failed && failed.code).toBe(1);
  expect((failed as { stderr: string }).stderr).toMatch(/403: .*read-only/);
  await ctx.dispose();
});

test("the Python script fetches every approved sheet and netlist with a maker's read token", async () => {
  const { ctx, token } = await tokenOf("maker", "read");
  const out = fs.mkdtempSync(path.join(os.tmpdir(), "sw-approved-"));
  const { stdout } = await run("python3", ["examples/fetch-approved.py", out], {
    env: { ...process.env, SENSEWRIGHT_URL: baseURL, SENSEWRIGHT_TOKEN: token },
  });
  const files = fs.readdirSync(out).sort();
  expect(files.length, stdout).toBeGreaterThanOrEqual(2);
  const pdf = files.find((f) => f.endsWith(".pdf"))!;
  const cir = files.find((f) => f.endsWith(".cir"))!;
  expect(fs.readFileSync(path.join(out, pdf)).subarray(0, 5).toString()).toBe("%PDF-");
  expect(fs.readFileSync(path.join(out, cir), "utf8")).toMatch(/^\.op/m);
  fs.rmSync(out, { recursive: true, force: true });
  await ctx.dispose();
});
