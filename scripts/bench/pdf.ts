// Build-sheet benchmark: the median warm render of a full build sheet (the demo logger, a draft, so
// the not-approved notice is on every page) against a baseline that writes the same text, in the
// same embedded typeface, size and place, with one rule per line of text, straight through the PDF
// library react-pdf writes with (pdfkit), with no layout engine. Both subset and embed the typeface
// and compress their streams. Reported as times and a ratio; nothing here asserts.
import { createRequire } from "node:module";
import { getDocumentProxy } from "unpdf";
import { fixtureView, loggerRequirement } from "../../lib/build-sheet/fixtures";
import { interFontData } from "../../lib/build-sheet/fonts";
import { renderBuildSheet } from "../../lib/build-sheet/render";

/** The part of pdfkit's API the baseline uses (the package ships no types). */
type PdfKitDoc = {
  registerFont(name: string, data: Buffer): PdfKitDoc;
  font(name: string): PdfKitDoc;
  fontSize(size: number): PdfKitDoc;
  text(text: string, x: number, y: number, opts?: { lineBreak?: boolean }): PdfKitDoc;
  moveTo(x: number, y: number): PdfKitDoc;
  lineTo(x: number, y: number): PdfKitDoc;
  lineWidth(w: number): PdfKitDoc;
  stroke(): PdfKitDoc;
  addPage(opts?: { size: string; margin: number }): PdfKitDoc;
  on(event: "data", fn: (chunk: Buffer) => void): void;
  on(event: "end", fn: () => void): void;
  end(): void;
};
const PDFDocument = createRequire(import.meta.url)("pdfkit") as new (opts: {
  size: string;
  margin: number;
  autoFirstPage: boolean;
}) => PdfKitDoc;

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? (s[mid] as number) : ((s[mid - 1] as number) + (s[mid] as number)) / 2;
};

type Run = { text: string; x: number; y: number; size: number; bold: boolean; width: number };

/** Every run of text on each page of a rendered sheet, where and how large it was drawn. */
async function textRuns(pdf: Buffer): Promise<Run[][]> {
  const doc = await getDocumentProxy(new Uint8Array(pdf));
  const pages: Run[][] = [];
  for (let p = 1; p <= doc.numPages; p++) {
    const content = await (await doc.getPage(p)).getTextContent();
    const runs: Run[] = [];
    for (const item of content.items) {
      if (!("str" in item) || !item.str.trim()) continue;
      const [size, , , , x, y] = item.transform as number[];
      const family = content.styles[item.fontName]?.fontFamily ?? "";
      runs.push({
        text: item.str,
        x: x!,
        y: 842 - y! - size!,
        size: size!,
        bold: /bold/i.test(family),
        width: item.width,
      });
    }
    pages.push(runs);
  }
  return pages;
}

function baseline(pages: Run[][], fonts: { regular: Buffer; bold: Buffer }): Promise<Buffer> {
  return new Promise((resolve) => {
    const doc = new PDFDocument({ size: "A4", margin: 0, autoFirstPage: false });
    const chunks: Buffer[] = [];
    doc.on("data", (c) => chunks.push(c));
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.registerFont("regular", fonts.regular).registerFont("bold", fonts.bold);
    for (const runs of pages) {
      doc.addPage({ size: "A4", margin: 0 });
      for (const r of runs) {
        doc
          .font(r.bold ? "bold" : "regular")
          .fontSize(r.size)
          .text(r.text, r.x, r.y, { lineBreak: false });
        const under = r.y + r.size * 1.3;
        doc
          .lineWidth(0.5)
          .moveTo(r.x, under)
          .lineTo(r.x + r.width, under)
          .stroke();
      }
    }
    doc.end();
  });
}

export async function run(): Promise<Record<string, number>> {
  const view = fixtureView(loggerRequirement, { status: "draft" });
  const meta = { team: "Harbourline Labs", generatedAt: new Date("2026-12-01T12:00:00Z") };
  // The first sheet in a process also opens its font files.
  const t0 = performance.now();
  const sheet = await renderBuildSheet(view, meta);
  const first = performance.now() - t0;
  const pages = await textRuns(sheet);
  // The same font data the sheet embeds (react-pdf reads it through fontkit, as pdfkit does here).
  const fonts = interFontData();
  const runBaseline = () => baseline(pages, fonts);
  const runSheet = () => renderBuildSheet(view, meta);
  for (let k = 0; k < 3; k++) {
    await runSheet();
    await runBaseline();
  }
  // Interleaved, so load from other processes falls on both alike.
  const sheetMs: number[] = [];
  const baseMs: number[] = [];
  for (let k = 0; k < 11; k++) {
    let t = performance.now();
    await runSheet();
    sheetMs.push(performance.now() - t);
    t = performance.now();
    await runBaseline();
    baseMs.push(performance.now() - t);
  }
  return {
    "pdf.ms": median(sheetMs),
    "pdf.baseline.ms": median(baseMs),
    "pdf.ratio": median(sheetMs) / median(baseMs),
    "pdf.pages": pages.length,
    "pdf.textRuns": pages.reduce((n, p) => n + p.length, 0),
    "pdf.first.inProcess.ms": first,
  };
}
