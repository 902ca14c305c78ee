// Server benchmark, on the built app serving the scale team (`npm run seed:scale`; seeded here into
// BENCH_SCALE_DIR, default .data/scale, when that directory is empty). Every figure is a ratio
// measured side by side in this one run, against /api/health on the same server, or first ÷ warm:
//   first use after start: solve.first.ratio, pdf.first.ratio, profile.firstChart.ratio
//   at scale (p50 ÷ health p50): designs.list.ratio, designs.search.ratio, design.page.ratio,
//     compare.ratio; and designs.list.scaleVsDemo, design.page.scaleVsDemo (the scale team's page ÷
//     the demo team's, to tell the cost of scale from the cost of the page)
//   under load: health.underSheets.p99Ratio (20 concurrent sheets), server.rss.MB after 20 connections
//   on a fresh demo database, after the same 20 connections: server.rss.demo.MB (goal < 600 MB)
// Pages are timed to the last byte of the whole response (the HTML with its RSC payload), as a
// browser would have it all, never to the first byte: nothing below the fold is left out by streaming.
// The page and compare figures also come as CPU ratios (*.cpuRatio: the server's CPU time per
// request ÷ health's, from /proc), which another process's load on this shared machine moves far
// less than wall time; page.floor.cpuRatio is the same for a signed-in page with nothing in it (a
// design id that is not there), the part of every page's cost that is the workbench's frame and the
// framework's rendering. First calls are timed once the server says its start-up work is done; a
// first call is one sample by nature (one start, one first call), its warm figure the median of
// eleven, so the ratio's noise is the first call's own.
// Build first (`npx next build`, or with NEXT_DIST_DIR). Nothing here asserts.
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { createInterface } from "node:readline";
import { request } from "@playwright/test";

const PORT = Number(process.env.BENCH_SERVER_PORT ?? 3319);
const BASE = `http://localhost:${PORT}`;
const DIR = path.resolve(process.env.BENCH_SCALE_DIR ?? ".data/scale");
const PASSWORD = "sensewright-demo";

const quantile = (xs: number[], q: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil(q * s.length) - 1))] as number;
};
const median = (xs: number[]) => quantile(xs, 0.5);

async function waitForHealth(server: ChildProcess, timeoutMs = 180_000) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (server.exitCode !== null) throw new Error(`the app exited with ${server.exitCode} before it was ready`);
    try {
      if ((await fetch(`${BASE}/api/health`)).ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`the app did not answer on ${BASE} within ${timeoutMs / 1000} s`);
}

/** A session cookie for `email`, through next-auth's credentials flow. */
async function sessionCookie(email: string): Promise<string> {
  const ctx = await request.newContext({ baseURL: BASE });
  try {
    const { csrfToken } = (await (await ctx.get("/api/auth/csrf")).json()) as { csrfToken: string };
    const res = await ctx.post("/api/auth/callback/credentials", {
      form: { csrfToken, email, password: PASSWORD, json: "true" },
      maxRedirects: 0,
    });
    if (res.status() !== 200) throw new Error(`sign-in as ${email} answered ${res.status()}`);
    const { cookies } = await ctx.storageState();
    return cookies.map((c) => `${c.name}=${c.value}`).join("; ");
  } finally {
    await ctx.dispose();
  }
}

type Call = { path: string; method?: "GET" | "POST"; body?: unknown; cookie?: string };

/** Milliseconds for one request, body read to the end; throws on a non-2xx answer. */
async function timed(call: Call): Promise<number> {
  const t0 = performance.now();
  const res = await fetch(`${BASE}${call.path}`, {
    method: call.method ?? "GET",
    headers: {
      ...(call.cookie ? { cookie: call.cookie } : {}),
      ...(call.body ? { "content-type": "application/json" } : {}),
    },
    body: call.body ? JSON.stringify(call.body) : undefined,
  });
  await res.arrayBuffer();
  const ms = performance.now() - t0;
  if (!res.ok) throw new Error(`${call.method ?? "GET"} ${call.path} answered ${res.status}`);
  return ms;
}

/** A process and all its descendants, with each one's resident memory in kB (Linux ps). */
function processTree(pid: number): Map<number, number> {
  const ps = spawnSync("ps", ["-eo", "pid=,ppid=,rss="], { encoding: "utf8" }).stdout;
  const rows = ps
    .trim()
    .split("\n")
    .map((l) => l.trim().split(/\s+/).map(Number) as [number, number, number]);
  const inTree = new Set([pid]);
  for (let grew = true; grew;) {
    grew = false;
    for (const [p, pp] of rows)
      if (inTree.has(pp) && !inTree.has(p)) {
        inTree.add(p);
        grew = true;
      }
  }
  return new Map(rows.filter(([p]) => inTree.has(p)).map(([p, , rss]) => [p, rss]));
}

/** The resident memory of a process and all its descendants, in MB. */
const treeRssMB = (pid: number) => [...processTree(pid).values()].reduce((kb, rss) => kb + rss, 0) / 1024;

/** CPU time (user + system) a process and its descendants have used, in ms (/proc, 100 ticks a second). */
function treeCpuMs(pid: number): number {
  let ticks = 0;
  for (const p of processTree(pid).keys()) {
    try {
      const fields = fs.readFileSync(`/proc/${p}/stat`, "utf8").split(") ")[1]!.split(" ");
      ticks += Number(fields[11]) + Number(fields[12]); // utime, stime
    } catch {
      /* exited meanwhile */
    }
  }
  return ticks * 10;
}

/**
 * The server's CPU time per request of each call: on a machine other work shares, a request's wall
 * time grows with their load, its CPU time much less. The calls take turns in blocks, three rounds,
 * so that the garbage one call leaves (collected during whichever runs next) and any drift in the
 * server's state fall on all of them alike rather than on the one measured after a heavy one.
 */
async function cpuPerRequest(pid: number, calls: Record<string, Call>, minRounds: number) {
  // /proc counts CPU in 10 ms ticks: each call runs until it has used at least 60 ticks over the
  // three rounds (a cheap one such as health needs a few hundred requests for that), so the
  // rounding stays under 2 %.
  const ROUNDS = 3;
  const MIN_CPU_MS = 600 / ROUNDS;
  const MAX_REQUESTS = 1000 / ROUNDS;
  const cpu: Record<string, number> = {};
  const requests: Record<string, number> = {};
  for (let round = 0; round < ROUNDS; round++) {
    for (const [k, c] of Object.entries(calls)) {
      const before = treeCpuMs(pid);
      let n = 0;
      while (n < MAX_REQUESTS && (n < minRounds / ROUNDS || treeCpuMs(pid) - before < MIN_CPU_MS)) {
        await timed(c);
        n++;
      }
      cpu[k] = (cpu[k] ?? 0) + treeCpuMs(pid) - before;
      requests[k] = (requests[k] ?? 0) + n;
    }
  }
  return Object.fromEntries(Object.keys(calls).map((k) => [k, cpu[k]! / requests[k]!]));
}

function ensureScaleData() {
  if (fs.existsSync(path.join(DIR, "PG_VERSION"))) return;
  console.error(`[bench] seeding the scale team into ${DIR} (once; a minute or two)…`);
  const seeded = spawnSync(process.execPath, ["--import", "tsx", "scripts/seed-scale.ts", "--dir", DIR], {
    stdio: "inherit",
  });
  if (seeded.status !== 0) throw new Error("npm run seed:scale failed");
}

/** `calls` sampled round-robin, one request at a time, so load from elsewhere falls on all alike. */
async function interleaved(calls: Record<string, Call>, rounds: number) {
  const out: Record<string, number[]> = Object.fromEntries(Object.keys(calls).map((k) => [k, []]));
  for (let r = 0; r < rounds; r++) for (const [k, c] of Object.entries(calls)) out[k]!.push(await timed(c));
  return out;
}

const solveBody = {
  current: { min: "2 mA", max: "180 mA" },
  supply: { voltage: "3.0 V", side: "low" },
  drop: { max: "60 mV" },
  readout: { kind: "adc", bits: 12, fullScale: "2.5 V" },
  resolution: { countsAtMin: 10 },
};

async function atScale(): Promise<Record<string, number>> {
  ensureScaleData();
  const server = spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-p", String(PORT)], {
    env: { ...process.env, PORT: String(PORT), PGLITE_DIR: DIR, SEED_DEMO: "0", NEXTAUTH_URL: BASE },
    stdio: ["ignore", "pipe", "ignore"],
    detached: true,
  });
  // Start-up loads the slow routes once after the server answers (lib/server-start.ts): a first
  // call timed while that still runs would be timed against the start-up's own work.
  let startedUp = false;
  const startUpDone = new Promise<void>((resolve) => {
    createInterface({ input: server.stdout! }).on("line", (line) => {
      if (/^\[start\] \d+ routes loaded/.test(line)) {
        startedUp = true;
        resolve();
      }
    });
  });
  try {
    await waitForHealth(server);
    await Promise.race([startUpDone, new Promise((r) => setTimeout(r, 120_000))]);
    if (!startedUp) console.error("[bench] the server did not say its start-up was done; timing anyway");
    const rssStartMB = treeRssMB(server.pid!);
    const designer = await sessionCookie("designer@scale.example");
    const demo = await sessionCookie("designer@harbourline.example");
    const as = (c: Omit<Call, "cookie">): Call => ({ ...c, cookie: designer });

    // Ids to open: the deep design (50 revisions), two more, and the profiles of the newest one.
    const first = (await (await fetch(`${BASE}/api/designs?limit=3`, { headers: { cookie: designer } })).json()) as {
      designs: { id: string }[];
    };
    const deep = (await (
      await fetch(`${BASE}/api/designs?q=${encodeURIComponent("long-running revision history")}`, {
        headers: { cookie: designer },
      })
    ).json()) as { designs: { id: string }[] };
    const deepId = deep.designs[0]?.id;
    if (!deepId || first.designs.length < 3) throw new Error("the scale data lack the designs the bench opens");
    const three = [deepId, ...first.designs.map((d) => d.id).filter((id) => id !== deepId)].slice(0, 3);
    // Charts: twelve profiles of the six newest designs, each design's list read first as its page
    // would. Each chart is of a profile not read before: the server keeps the last few decoded
    // (db/queries/profiles.ts), and a warm figure served from there would be set against a first
    // chart that reads and decodes its samples (the bench did so until 2026-12-02).
    const newest = (await (await fetch(`${BASE}/api/designs?limit=6`, { headers: { cookie: designer } })).json()) as {
      designs: { id: string }[];
    };
    const charts: Call[] = [];
    for (const d of newest.designs) {
      const listed = (await (
        await fetch(`${BASE}/api/designs/${d.id}/profiles`, { headers: { cookie: designer } })
      ).json()) as { profiles: { id: string }[] };
      for (const p of listed.profiles) charts.push(as({ path: `/api/designs/${d.id}/profiles/${p.id}?width=800` }));
    }
    if (charts.length < 12) throw new Error("the scale data lack twelve profiles on the newest designs");
    const demoFirst = (await (await fetch(`${BASE}/api/designs?limit=1`, { headers: { cookie: demo } })).json()) as {
      designs: { id: string }[];
    };
    const demoDesignId = demoFirst.designs[0]?.id;
    if (!demoDesignId) throw new Error("the scale data lack the demo team's designs");

    // First use of each after start, then the same warm (a chart of another profile, so no cache helps).
    const firsts = {
      solve: await timed(as({ path: "/api/solve", method: "POST", body: solveBody })),
      pdf: await timed(as({ path: `/api/designs/${deepId}/build-sheet` })),
      chart: await timed(charts[0]!),
    };
    const warmSolve: number[] = [];
    const warmPdf: number[] = [];
    const warmChart: number[] = [];
    for (let k = 0; k < 11; k++) {
      warmSolve.push(await timed(as({ path: "/api/solve", method: "POST", body: solveBody })));
      warmPdf.push(await timed(as({ path: `/api/designs/${deepId}/build-sheet` })));
      warmChart.push(await timed(charts[1 + k]!));
    }

    // At scale, side by side with health. A warm-up round first (routes and pages load on first use).
    const calls: Record<string, Call> = {
      health: { path: "/api/health" },
      list: as({ path: "/api/designs" }),
      search: as({ path: `/api/designs?q=${encodeURIComponent("tide")}` }),
      searchRare: as({ path: `/api/designs?q=${encodeURIComponent("radio burst 0997")}` }),
      demoList: { path: "/api/designs", cookie: demo },
      designPage: as({ path: `/designs/${deepId}` }),
      demoDesignPage: { path: `/designs/${demoDesignId}`, cookie: demo },
      compare: as({ path: `/compare?ids=${three.join(",")}` }),
    };
    await interleaved(calls, 2);
    // 61 rounds: with 21, one run's medians of the two pages moved by ±0.6 × health between runs.
    const t = await interleaved(calls, 61);
    const health = median(t.health!);
    const cpu = await cpuPerRequest(
      server.pid!,
      {
        health: calls.health!,
        designPage: calls.designPage!,
        compare: calls.compare!,
        // The least a signed-in page costs: the workbench's frame around a design that is not there
        // (its "not found" is streamed inside the frame, so the answer is a 200).
        floorPage: as({ path: "/designs/00000000-0000-4000-8000-000000000000" }),
      },
      40,
    );

    // Health while 20 build sheets render at once, against health idle (p99 of each). The idle
    // p99 from 500 requests: from 100 it is the second-largest of them, and moved 8.8–25 ms between runs.
    const idle = (await interleaved({ health: calls.health! }, 500)).health!;
    const sheetLoad = Promise.all(
      Array.from({ length: 20 }, () =>
        timed(as({ path: `/api/designs/${three[1 + Math.floor(Math.random() * 2)]}/build-sheet` })),
      ),
    );
    const busy: number[] = [];
    let loading = true;
    void sheetLoad.finally(() => (loading = false));
    while (loading || busy.length < 20) busy.push(await timed(calls.health!));
    await sheetLoad;

    // 20 connections on the busiest routes, then the memory the server keeps.
    const mix = [
      calls.list!,
      calls.search!,
      as({ path: "/api/solve", method: "POST", body: solveBody }),
      calls.designPage!,
    ];
    await Promise.all(
      Array.from({ length: 20 }, async (_, w) => {
        for (let k = 0; k < 10; k++) await timed(mix[(w + k) % mix.length]!);
      }),
    );
    await new Promise((r) => setTimeout(r, 1000));
    const rssAfterMB = treeRssMB(server.pid!);

    return {
      "solve.first.ms": firsts.solve,
      "solve.first.ratio": firsts.solve / median(warmSolve),
      "pdf.first.ms": firsts.pdf,
      "pdf.warm.ms": median(warmPdf),
      "pdf.first.ratio": firsts.pdf / median(warmPdf),
      "profile.firstChart.ratio": firsts.chart / median(warmChart),
      "health.p50.ms": health,
      "designs.list.ratio": median(t.list!) / health,
      "designs.search.ratio": median(t.search!) / health,
      "designs.searchRare.ratio": median(t.searchRare!) / health,
      "designs.list.scaleVsDemo": median(t.list!) / median(t.demoList!),
      "design.page.ratio": median(t.designPage!) / health,
      "design.page.scaleVsDemo": median(t.designPage!) / median(t.demoDesignPage!),
      "compare.ratio": median(t.compare!) / health,
      "design.page.cpuRatio": cpu.designPage! / cpu.health!,
      "compare.cpuRatio": cpu.compare! / cpu.health!,
      "page.floor.cpuRatio": cpu.floorPage! / cpu.health!,
      "health.idle.p99.ms": quantile(idle, 0.99),
      "health.underSheets.p99.ms": quantile(busy, 0.99),
      "health.underSheets.p99Ratio": quantile(busy, 0.99) / quantile(idle, 0.99),
      "server.rss.start.MB": Math.round(rssStartMB),
      "server.rss.MB": Math.round(rssAfterMB),
    };
  } finally {
    try {
      if (server.pid) process.kill(-server.pid, "SIGTERM");
    } catch {
      /* already gone */
    }
    await new Promise((r) => setTimeout(r, 1000));
  }
}

/**
 * The memory of the same built server on a fresh demo database (the demo team only, as a new
 * install has it, seeded at start as scripts/serve-test.mjs does), before and after the same
 * 20-connection mix of list, search, solve and design page as the demo designer. Run after the scale
 * server has stopped, on the same port.
 */
async function onDemoData(): Promise<Record<string, number>> {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), "sensewright-bench-demo-"));
  const server = spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-p", String(PORT)], {
    env: { ...process.env, PORT: String(PORT), PGLITE_DIR: dataDir, SEED_DEMO: "1", NEXTAUTH_URL: BASE },
    stdio: ["ignore", "pipe", "ignore"],
    detached: true,
  });
  const startUpDone = new Promise<boolean>((resolve) => {
    createInterface({ input: server.stdout! }).on("line", (line) => {
      if (/^\[start\] \d+ routes loaded/.test(line)) resolve(true);
    });
  });
  try {
    await waitForHealth(server);
    if (!(await Promise.race([startUpDone, new Promise<false>((r) => setTimeout(() => r(false), 120_000))])))
      console.error("[bench] the demo server did not say its start-up was done; measuring anyway");
    const rssStartMB = treeRssMB(server.pid!);
    const cookie = await sessionCookie("designer@harbourline.example");
    const first = (await (await fetch(`${BASE}/api/designs?limit=1`, { headers: { cookie } })).json()) as {
      designs: { id: string }[];
    };
    const designId = first.designs[0]?.id;
    if (!designId) throw new Error("the demo database has no designs to open");
    const mix: Call[] = [
      { path: "/api/designs", cookie },
      { path: `/api/designs?q=${encodeURIComponent("logger")}`, cookie },
      { path: "/api/solve", method: "POST", body: solveBody, cookie },
      { path: `/designs/${designId}`, cookie },
    ];
    await Promise.all(
      Array.from({ length: 20 }, async (_, w) => {
        for (let k = 0; k < 10; k++) await timed(mix[(w + k) % mix.length]!);
      }),
    );
    await new Promise((r) => setTimeout(r, 1000));
    return {
      "server.rss.demo.start.MB": Math.round(rssStartMB),
      "server.rss.demo.MB": Math.round(treeRssMB(server.pid!)),
    };
  } finally {
    try {
      if (server.pid) process.kill(-server.pid, "SIGTERM");
    } catch {
      /* already gone */
    }
    await new Promise((r) => setTimeout(r, 1000));
    fs.rmSync(dataDir, { recursive: true, force: true });
  }
}

export async function run(): Promise<Record<string, number>> {
  return { ...(await atScale()), ...(await onDemoData()) };
}

// `npx tsx scripts/bench/server.ts [demo]`: the whole section, or the demo-data memory alone.
if (import.meta.url === `file://${process.argv[1]}`) {
  (process.argv[2] === "demo" ? onDemoData() : run()).then((r) => console.log(JSON.stringify(r, null, 2)));
}
