// The plain-file exports of a saved design: the parts list as CSV, the whole design as JSON
// (our own versioned format, which imports back as a new design), and their file names.
import { z } from "zod";
import { writeCsv, type CsvCell } from "@/lib/csv-write";
import { buildNetlist, evaluateCandidate, planChoiceSchema, type Choice, type PlanChoice } from "@/lib/design";
import type { DesignView, PairDesignView } from "@/lib/design-view";
import { choiceSchema, oneOfChoiceOrPlan } from "@/lib/saved-designs/service";
import { designSlug } from "./slug";
import { designParts, type LibraryParts } from "./library-parts";
import type { Part } from "./parts";
import { textField } from "@/lib/text-field";

export const EXPORT_FORMAT = "sensewright-design";
export const EXPORT_VERSION = 1;

/** "<design-slug>-rev<N>.<ext>" */
export function exportFileName(view: Pick<DesignView, "name" | "revision">, ext: string): string {
  return `${designSlug(view.name)}-rev${view.revision}.${ext}`;
}

export function attachment(fileName: string): string {
  return `attachment; filename="${fileName}"`;
}

/** The design's SPICE netlist: exactly what POST /api/netlist gives for its requirement and choice. */
export function designNetlist(
  view: Pick<PairDesignView, "requirement" | "choice">,
  opts: { includeOffset: boolean },
): string {
  return buildNetlist(view.requirement, view.choice, opts);
}

export const csvColumns = [
  "designator",
  "part",
  "value",
  "tolerance",
  "tempco",
  "rating",
  "notes",
  "value_si",
  "unit",
  "code",
] as const;

export function csvCell(p: Part, col: (typeof csvColumns)[number]): CsvCell {
  if (col === "value_si") return p.valueSI;
  if (col === "unit") return p.unit ?? "";
  if (col === "code") return p.code ?? "";
  return p[col];
}

/**
 * RFC 4180: a header row, CRLF line ends, fields quoted when they hold a comma, quote or line break;
 * text that a spreadsheet would run as a formula gets a leading apostrophe (writeCsv).
 */
export function partsCsv(view: Pick<PairDesignView, "requirement" | "choice">, library?: LibraryParts): string {
  // Named after the team-library parts the pair came from, as on the build sheet.
  const rows = designParts(view.requirement, view.choice, evaluateCandidate(view.requirement, view.choice), library);
  return writeCsv(
    csvColumns,
    rows.map((p) => csvColumns.map((c) => csvCell(p, c))),
    "\r\n",
  );
}

export type DesignExport = {
  format: typeof EXPORT_FORMAT;
  version: typeof EXPORT_VERSION;
  name: string;
  project: string | null;
  requirement: DesignView["requirement"];
  /** One of the two, as the design holds: a single shunt and gain, or a range plan. */
  choice?: Choice;
  plan?: PlanChoice;
  /** Informational: where and when it came from, and the figures it had. Import recomputes them. */
  exportedAt: string;
  source: { designId: string; revision: number; status: DesignView["status"] };
  metrics: DesignView["metrics"];
};

export function designExport(view: DesignView, exportedAt: Date): DesignExport {
  return {
    format: EXPORT_FORMAT,
    version: EXPORT_VERSION,
    name: view.name,
    project: view.project,
    requirement: view.requirement,
    ...(view.kind === "plan" ? { plan: view.plan } : { choice: view.choice }),
    exportedAt: exportedAt.toISOString(),
    source: { designId: view.id, revision: view.revision, status: view.status },
    metrics: view.metrics,
  };
}

/** What an import accepts: the export's own fields; the informational ones are ignored. */
export const designImportSchema = z
  .object(
    {
      format: z.literal(EXPORT_FORMAT, {
        error: `format: expected "${EXPORT_FORMAT}" (a file exported from a design)`,
      }),
      version: z.literal(EXPORT_VERSION, { error: `version: this build reads version ${EXPORT_VERSION} files` }),
      name: textField({ label: "name", min: 1, minMessage: "name: give the design a name", max: 200 }),
      project: textField({ label: "project", max: 200 }).nullish(),
      requirement: z.record(z.string(), z.unknown(), { error: "requirement: expected an object" }),
      choice: choiceSchema.optional(),
      plan: planChoiceSchema.optional(),
    },
    { error: "Expected a design file: a JSON object" },
  )
  .superRefine((b, ctx) => oneOfChoiceOrPlan(b, ctx, true));
export type DesignImport = z.infer<typeof designImportSchema>;
