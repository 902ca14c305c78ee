// Build sheets rendered on worker threads (render-worker.ts), one job at a time per worker, so the
// request thread never runs react-pdf's layout. Twenty sheets asked for at once queue here; the
// server keeps answering everything else meanwhile. A worker that dies or hangs is replaced.
import "server-only";
import os from "node:os";
import { Worker } from "node:worker_threads";
import type { DesignView } from "@/lib/design-view";
import { HttpError } from "@/lib/http";
import type { LibraryParts } from "./library-parts";
import type { SheetMeta } from "./pdf/document";
import type { SheetAnswer, SheetJob } from "./render-worker";

/**
 * One worker per spare core, at least one: the request thread keeps a core, and each worker holds
 * its own copy of react-pdf and the typefaces (about 60 MB), so more would cost memory for nothing.
 */
export const SHEET_WORKERS = Math.max(1, Math.min(4, os.availableParallelism() - 1));
/**
 * The young generation of each worker's heap. V8's default lets it grow to 48 MB and keep it, on
 * top of react-pdf and the typefaces; a sheet's garbage is short-lived and dies in a smaller one
 * just as well. Only the young generation is limited: a cap on the old one would end a worker
 * mid-sheet.
 */
const WORKER_YOUNG_GENERATION_MB = 16;
/** Sheets waiting beyond this are refused with 503 rather than held in memory without end. */
const MAX_WAITING = 200;
/** A sheet renders in well under a second; one that takes this long is stuck, and its worker is replaced. */
const JOB_TIMEOUT_MS = 60_000;

type Pending = { job: SheetJob; resolve: (pdf: Buffer) => void; reject: (e: Error) => void };
type Slot = { worker: Worker; busy: Pending | null; timer?: NodeJS.Timeout };

class SheetPool {
  private slots: Slot[] = [];
  private waiting: Pending[] = [];
  private nextId = 1;

  render(view: DesignView, meta: SheetMeta, library?: LibraryParts): Promise<Buffer> {
    if (this.waiting.length >= MAX_WAITING)
      return Promise.reject(
        new HttpError(503, "Too many build sheets are being made right now; try again in a minute. Nothing was lost."),
      );
    return new Promise<Buffer>((resolve, reject) => {
      this.waiting.push({ job: { id: this.nextId++, view, meta, library }, resolve, reject });
      this.pump();
    });
  }

  private pump() {
    while (this.waiting.length) {
      const slot = this.slots.find((s) => !s.busy) ?? (this.slots.length < SHEET_WORKERS ? this.spawn() : null);
      if (!slot) return;
      const next = this.waiting.shift()!;
      slot.busy = next;
      slot.timer = setTimeout(
        () => this.fail(slot, new Error("the build sheet took too long to render")),
        JOB_TIMEOUT_MS,
      );
      slot.worker.postMessage(next.job);
    }
  }

  private spawn(): Slot {
    const worker = new Worker(new URL("./render-worker.ts", import.meta.url), {
      resourceLimits: { maxYoungGenerationSizeMb: WORKER_YOUNG_GENERATION_MB },
    });
    const slot: Slot = { worker, busy: null };
    worker.on("message", (answer: SheetAnswer) => {
      const done = slot.busy;
      if (!done || done.job.id !== answer.id) return;
      clearTimeout(slot.timer);
      slot.busy = null;
      if ("pdf" in answer) done.resolve(Buffer.from(answer.pdf.buffer, answer.pdf.byteOffset, answer.pdf.byteLength));
      else done.reject(new Error(answer.error));
      this.pump();
    });
    worker.on("error", (err) => this.fail(slot, err));
    worker.on("exit", (code) => this.fail(slot, new Error(`the build-sheet worker stopped (exit code ${code})`)));
    // An idle worker must not keep the process alive at shutdown.
    worker.unref();
    this.slots.push(slot);
    return slot;
  }

  /** Drops a worker that failed or hung: its job is refused, the rest go to a fresh one. */
  private fail(slot: Slot, err: Error) {
    if (!this.slots.includes(slot)) return;
    this.slots = this.slots.filter((s) => s !== slot);
    clearTimeout(slot.timer);
    slot.busy?.reject(err);
    slot.busy = null;
    void slot.worker.terminate();
    this.pump();
  }
}

const globalKey = Symbol.for("sensewright.sheetPool");
type GlobalWithPool = typeof globalThis & { [globalKey]?: SheetPool };

/** The process's one pool (cached on globalThis: Next loads modules separately for routes and start-up). */
function pool(): SheetPool {
  const g = globalThis as GlobalWithPool;
  return (g[globalKey] ??= new SheetPool());
}

/** renderBuildSheet on a worker thread: the same bytes, without blocking the request thread. */
export function renderBuildSheetOffThread(view: DesignView, meta: SheetMeta, library?: LibraryParts): Promise<Buffer> {
  return pool().render(view, meta, library);
}
