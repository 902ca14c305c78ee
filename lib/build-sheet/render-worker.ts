// A worker thread that renders build sheets (render-pool.ts sends the jobs). react-pdf lays out
// and writes a sheet synchronously for 100 ms and more; here that time is off the thread that
// answers requests, so /api/health and every other route keep answering while sheets render.
import { parentPort } from "node:worker_threads";
import type { DesignView } from "@/lib/design-view";
import type { LibraryParts } from "./library-parts";
import type { SheetMeta } from "./pdf/document";
import { renderBuildSheet, renderPlanBuildSheet } from "./render";

export type SheetJob = { id: number; view: DesignView; meta: SheetMeta; library?: LibraryParts };
export type SheetAnswer = { id: number; pdf: Uint8Array } | { id: number; error: string };

const port = parentPort;
if (!port) throw new Error("render-worker.ts runs as a worker thread (render-pool.ts starts it)");

port.on("message", (job: SheetJob) => {
  const { view } = job;
  const sheet =
    view.kind === "plan"
      ? renderPlanBuildSheet(view, view.requirement, view.plan, job.meta)
      : renderBuildSheet(view, job.meta, job.library);
  sheet.then(
    (pdf) => {
      // A copy of its own, so the transfer hands over exactly the PDF and not a pooled buffer.
      const bytes = new Uint8Array(pdf);
      port.postMessage({ id: job.id, pdf: bytes } satisfies SheetAnswer, [bytes.buffer]);
    },
    (err: unknown) =>
      port.postMessage({ id: job.id, error: (err as Error).message ?? String(err) } satisfies SheetAnswer),
  );
});
