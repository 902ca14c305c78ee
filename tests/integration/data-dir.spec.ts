// The data directory is held by one process at a time, and a killed server loses nothing.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { expect, request, test } from "@playwright/test";
import { parseRequirement, solve } from "../../lib/design";
import { demoEmail, signInApi } from "../fixtures/auth";
import { startServer, waitHealthy, type StartedServer } from "../fixtures/server";

const basePort = Number(process.env.E2E_PORT ?? 3210) + 50;
let dir = "";
const started: StartedServer[] = [];

test.beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "sensewright-lock-"));
});

test.afterAll(async () => {
  for (const s of started) if (s.proc.exitCode === null) s.proc.kill("SIGKILL");
  fs.rmSync(dir, { recursive: true, force: true });
});

test("a second server on the same data directory refuses to start, naming the directory and the holder", async () => {
  test.setTimeout(120_000);
  const first = startServer(dir, basePort);
  started.push(first);
  expect(await waitHealthy(first), first.output()).toBe(true);

  const second = startServer(dir, basePort + 1);
  started.push(second);
  // next start answers only after instrumentation, which exits on the lock: the process ends non-zero.
  const code = await Promise.race([second.exited, new Promise((r) => setTimeout(() => r("timeout"), 60_000))]);
  expect(code).toBe(1);
  expect(second.output()).toContain(`The data directory ${dir} is already open in process`);

  // The first server is unharmed.
  expect((await fetch(`${first.url}/api/health`)).status).toBe(200);
  first.proc.kill("SIGTERM");
  await first.exited;
});

test("a server killed with SIGKILL restarts on the same directory with every row still there", async () => {
  test.setTimeout(180_000);
  const a = startServer(dir, basePort + 2);
  started.push(a);
  expect(await waitHealthy(a), a.output()).toBe(true);

  const owner = await request.newContext({ baseURL: a.url });
  expect(await signInApi(owner, demoEmail("owner"))).toBe(true);
  const team = (await (await owner.get("/api/team")).json()) as { members: { userId: string; email: string }[] };
  const maker = team.members.find((m) => m.email === demoEmail("maker"))!;
  const changed = await owner.patch(`/api/team/members/${maker.userId}`, { data: { role: "reviewer" } });
  expect(changed.status()).toBe(200);
  // A design saved just before the kill.
  const requirement = {
    current: { min: "5 mA", max: "200 mA" },
    supply: { voltage: "5 V", side: "low" },
    drop: { max: "100 mV" },
    readout: { kind: "adc", bits: 12, fullScale: "2.5 V" },
    // The converter's own error is its class's typical figures; zeroed once, 1 % is within reach.
    calibration: "one-point",
  };
  const parsed = parseRequirement(requirement);
  if (!parsed.ok) throw new Error(parsed.message);
  const pick = solve(parsed.requirement).candidates.find((c) => c.feasible)!;
  const saved = await owner.post("/api/designs", {
    data: { name: "Saved before the kill", requirement, choice: { shuntOhms: pick.shuntOhms, gain: pick.gain } },
  });
  expect(saved.status(), await saved.text()).toBe(201);
  const { id } = (await saved.json()) as { id: string };
  const before = (await (await owner.get("/api/team")).json()) as unknown;
  const designBefore = (await (await owner.get(`/api/designs/${id}`)).json()) as unknown;
  const listBefore = (await (await owner.get("/api/designs")).json()) as { designs: unknown[] };
  await owner.dispose();

  a.proc.kill("SIGKILL");
  await a.exited;
  expect(fs.existsSync(path.join(dir, "sensewright.lock")), "the dead server's lock is left behind").toBe(true);

  const b = startServer(dir, basePort + 3);
  started.push(b);
  expect(await waitHealthy(b), b.output()).toBe(true);
  expect(b.output()).toContain("taking over the stale lock");
  const again = await request.newContext({ baseURL: b.url });
  // The generated secret survived too: the same accounts sign in.
  expect(await signInApi(again, demoEmail("owner"))).toBe(true);
  expect(await (await again.get("/api/team")).json()).toEqual(before);
  expect(await (await again.get(`/api/designs/${id}`)).json()).toEqual(designBefore);
  expect(((await (await again.get("/api/designs")).json()) as { designs: unknown[] }).designs).toHaveLength(
    listBefore.designs.length,
  );
  await again.dispose();
  b.proc.kill("SIGTERM");
  await b.exited;
});
