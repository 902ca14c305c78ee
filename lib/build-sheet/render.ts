// Renders a saved design's build sheet to PDF bytes, with the sheet's own embedded typeface.
import { createElement } from "react";
import { Font, renderToBuffer } from "@react-pdf/renderer";
import type { DesignView } from "@/lib/design-view";
import { sheetFonts } from "./font";
import { BuildSheetDocument, PLANNED_PAGES, type SheetMeta } from "./pdf/document";
import { FONT } from "./pdf/theme";
import type { LibraryParts } from "./library-parts";
import { sheetData, type SheetData } from "./sheet-data";

function registerFonts() {
  // Asked of react-pdf itself: a module reload in development gives it a fresh, empty registry.
  if (Font.getRegisteredFontFamilies().includes(FONT)) return;
  const { regular, bold } = sheetFonts();
  const url = (b: Uint8Array) => `data:font/ttf;base64,${Buffer.from(b).toString("base64")}`;
  Font.register({
    family: FONT,
    fonts: [
      { src: url(regular), fontWeight: 400 },
      { src: url(bold), fontWeight: 700 },
    ],
  });
  // Words are not split across lines: a part number or a value cut in two is a misreading.
  Font.registerHyphenationCallback((word) => [word]);
}

/** Pages in a finished PDF (react-pdf writes each page object uncompressed). */
export function pdfPageCount(pdf: Buffer): number {
  return pdf.toString("latin1").match(/\/Type\s*\/Page(?![s\w])/g)?.length ?? 0;
}

type DocElement = Parameters<typeof renderToBuffer>[0];

export async function renderBuildSheet(view: DesignView, opts: SheetMeta, library?: LibraryParts): Promise<Buffer> {
  return renderSheet(view, sheetData(view, library), opts);
}

/** The same, from sheet data already worked out (tests feed it oversized data). */
export async function renderSheet(view: DesignView, data: SheetData, opts: SheetMeta): Promise<Buffer> {
  registerFonts();
  // Page numbers written in advance spare react-pdf a second layout of every page; if some
  // page's content overflowed (a very long name, say), the count is off, so lay it out again
  // with numbers the layout works out.
  const planned = await renderToBuffer(
    createElement(BuildSheetDocument, { view, data, meta: opts }) as unknown as DocElement,
  );
  if (pdfPageCount(planned) === PLANNED_PAGES) return planned;
  return renderToBuffer(
    createElement(BuildSheetDocument, {
      view,
      data,
      meta: opts,
      numbering: { kind: "dynamic" },
    }) as unknown as DocElement,
  );
}
