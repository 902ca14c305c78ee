// Page weight: the JavaScript each page makes a browser download, gzipped, summed over the
// <script src> tags of the page as served (Next 16's build no longer prints first-load sizes).
// The floor is a plain signed-in page (the outbox: the workbench's layout and a server-rendered
// list); budgets are above it: a list page at most 40 kB, a page that parses quantities as they
// are typed (the wizard, the meter check) at most 150 kB. A design page (the demo pump controller:
// figures, charts, reviews, built units) shows saved figures and parses nothing as it is typed, so
// it carries no unit parser either: at most 100 kB above the floor (its charts draw with visx).
// Prints js.<page>.kB, js.<page>.above_floor.kB and js.budgets_met (1 or 0); asserts nothing.
import { gzipSync } from "node:zlib";
import { signIn, startBenchApp } from "../bench-app";

const PORT = Number(process.env.BENCH_PAGES_PORT ?? 3319);

/** Page name in the output → path (or the demo design whose page it is) and the budget above the floor, kB. */
const PAGES: { name: string; path: string | { designProject: string }; budgetKB?: number }[] = [
  { name: "floor", path: "/outbox" },
  { name: "designs", path: "/designs", budgetKB: 40 },
  { name: "library", path: "/library", budgetKB: 40 },
  { name: "team", path: "/team", budgetKB: 40 },
  // The meter check validates quantities as they are typed, so it carries the unit parser.
  { name: "meter", path: "/meter", budgetKB: 150 },
  { name: "designs_new", path: "/designs/new", budgetKB: 150 },
  { name: "design", path: { designProject: "Pump controller" }, budgetKB: 100 },
];

const scriptSources = (html: string) => [...html.matchAll(/<script[^>]*\ssrc="([^"]+)"/g)].map((m) => m[1] ?? "");

export async function run(): Promise<Record<string, number>> {
  const { base, browser, stop } = await startBenchApp(PORT);
  try {
    const page = await browser.newPage();
    await signIn(page, base, "owner@harbourline.example");
    const request = page.context().request;
    const gz = new Map<string, number>();
    const out: Record<string, number> = {};
    const designPath = async (project: string) => {
      const list = await request.get(`${base}/api/designs?q=${encodeURIComponent(project)}`);
      const found = ((await list.json()) as { designs: { id: string; project: string | null }[] }).designs.find(
        (d) => d.project === project,
      );
      if (!found) throw new Error(`no demo design of the project "${project}"`);
      return `/designs/${found.id}`;
    };
    for (const p of PAGES) {
      const path = typeof p.path === "string" ? p.path : await designPath(p.path.designProject);
      const res = await request.get(`${base}${path}`);
      if (!res.ok()) throw new Error(`${path} answered ${res.status()}`);
      let bytes = 0;
      for (const src of new Set(scriptSources(await res.text()))) {
        if (!gz.has(src)) {
          const js = await request.get(new URL(src, base).href);
          gz.set(src, gzipSync(await js.body()).length);
        }
        bytes += gz.get(src)!;
      }
      out[`js.${p.name}.kB`] = bytes / 1000;
    }
    const floor = out["js.floor.kB"]!;
    let met = 1;
    for (const p of PAGES) {
      if (p.budgetKB === undefined) continue;
      const above = out[`js.${p.name}.kB`]! - floor;
      out[`js.${p.name}.above_floor.kB`] = above;
      if (above > p.budgetKB) met = 0;
    }
    out["js.budgets_met"] = met;
    return out;
  } finally {
    await stop();
  }
}
