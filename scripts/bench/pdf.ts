// Build-sheet benchmark: the median warm render of a full build sheet (the demo logger, a draft,
// so the not-approved notice is on every page) against a bare one-page react-pdf document
// rendered in the same process. Reported as a time and a ratio; nothing here asserts.
import { createElement } from "react";
import { Document, Page, Text, renderToBuffer } from "@react-pdf/renderer";
import { fixtureView, loggerRequirement } from "../../lib/build-sheet/fixtures";
import { LABEL_FONTS, sheetFonts } from "../../lib/build-sheet/fonts";
import { renderBuildSheet } from "../../lib/build-sheet/render";

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? (s[mid] as number) : ((s[mid - 1] as number) + (s[mid] as number)) / 2;
};

async function time(repeats: number, fn: () => Promise<unknown>): Promise<number> {
  for (let k = 0; k < 3; k++) await fn(); // warm-up: fonts opened, modules and JIT settled
  const t: number[] = [];
  for (let k = 0; k < repeats; k++) {
    const t0 = performance.now();
    await fn();
    t.push(performance.now() - t0);
  }
  return median(t);
}

function bareDocument(fontFamily?: string[]) {
  const style = fontFamily ? { fontFamily } : undefined;
  return createElement(
    Document,
    null,
    createElement(Page, { size: "A4", style }, createElement(Text, null, "Sensewright 4.7 mΩ")),
  );
}

export async function run(): Promise<Record<string, number>> {
  const view = fixtureView(loggerRequirement, { status: "draft" });
  const meta = { team: "Harbourline Labs", generatedAt: new Date("2026-12-01T12:00:00Z") };
  // The first sheet in a process also opens its font files.
  const t0 = performance.now();
  await renderBuildSheet(view, meta);
  const first = performance.now() - t0;
  const sheet = await time(9, () => renderBuildSheet(view, meta));
  const bare = await time(9, () => renderToBuffer(bareDocument()));
  // For scale: the same bare page in the sheet's embedded typeface (subset and embedded each time).
  sheetFonts(""); // registers the label families
  const bareFont = await time(9, () => renderToBuffer(bareDocument(LABEL_FONTS)));
  return {
    "pdf.ms": sheet,
    "pdf.ratio": sheet / bare,
    "pdf.bare.ms": bare,
    "pdf.bare_font.ms": bareFont,
    "pdf.first.ms": first,
  };
}
