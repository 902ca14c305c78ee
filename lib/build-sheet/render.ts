// Renders a saved design's build sheet to PDF bytes, in typefaces embedded from npm font files.
import { Font, renderToBuffer } from "@react-pdf/renderer";
import type { PairDesignView as DesignView } from "@/lib/design-view";
import { breakPoints, sheetFonts } from "./fonts";
import { BuildSheetDocument, PLANNED_PAGES, type SheetMeta } from "./pdf/document";
import { oneLine } from "@/lib/text-field";
import { namesOnOneLine, sheetData, type SheetData } from "./sheet-data";
import type { LibraryParts } from "./library-parts";
import type { PlanChoice, Requirement } from "@/lib/design";
import { PlanBuildSheetDocument, type PlanSheetView } from "./pdf/plan-document";
import { planSheetData } from "./plan-sheet-data";

/** Registers the typefaces a sheet's text needs and answers the family list to set it in. */
function fontsFor(view: unknown, data: unknown, meta: SheetMeta): string[] {
  Font.registerHyphenationCallback(breakPoints);
  return sheetFonts(JSON.stringify([view, data, meta.team]));
}

/** Pages in a finished PDF (react-pdf writes each page object uncompressed). */
export function pdfPageCount(pdf: Buffer): number {
  return pdf.toString("latin1").match(/\/Type\s*\/Page(?![s\w])/g)?.length ?? 0;
}

export async function renderBuildSheet(view: DesignView, opts: SheetMeta, library?: LibraryParts): Promise<Buffer> {
  return renderSheet(view, sheetData(view, library), opts);
}

/** The same, from sheet data already worked out (tests feed it oversized data). */
export async function renderSheet(view: DesignView, data: SheetData, opts: SheetMeta): Promise<Buffer> {
  view = namesOnOneLine(view);
  opts = { ...opts, team: oneLine(opts.team) };
  const fonts = fontsFor(view, data, opts);
  // Page numbers written in advance spare react-pdf a second layout of every page; if some
  // page's content overflowed (a very long name, say), the count is off, so lay it out again
  // with numbers the layout works out.
  // BuildSheetDocument uses no hooks, so calling it hands react-pdf the <Document> element itself,
  // which is the element type renderToBuffer is typed for.
  const planned = await renderToBuffer(BuildSheetDocument({ view, data, meta: opts, fonts }));
  if (pdfPageCount(planned) === PLANNED_PAGES) return planned;
  return renderToBuffer(BuildSheetDocument({ view, data, meta: opts, fonts, numbering: { kind: "dynamic" } }));
}

/** A range plan's sheet (lib/build-sheet/plan-sheet-data.ts words the engine's figures). */
export async function renderPlanBuildSheet(
  view: PlanSheetView,
  req: Requirement,
  plan: PlanChoice,
  opts: SheetMeta,
): Promise<Buffer> {
  view = namesOnOneLine(view);
  opts = { ...opts, team: oneLine(opts.team) };
  const data = planSheetData(req, plan);
  const fonts = fontsFor(view, data, opts);
  // PlanBuildSheetDocument uses no hooks: calling it hands react-pdf the <Document> element itself.
  return renderToBuffer(PlanBuildSheetDocument({ view, req, data, meta: opts, fonts }));
}
