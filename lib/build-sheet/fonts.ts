// The build sheet's typefaces: static WOFF files from npm that react-pdf reads as they are.
// They are handed to react-pdf as plain sfnt data, made once from each WOFF (./woff.ts says why).
// Inter (a real regular and a real bold, one file each for Latin, Greek and Cyrillic together)
// sets the sheet; Noto Sans SC draws the Chinese and Japanese a design's name or project may
// hold. react-pdf picks, character by character, the first family of a list that has the glyph.
//
// Inter must be one file: where a word changes font, react-pdf may break the line there with a
// hyphen, so "mΩ" set from two files could print as "m-" and "Ω" on two lines. Noto Sans SC
// comes only in unicode-range slices (about a hundred, as web fonts are cut), so each slice is
// a family of its own and a sheet lists only the slices its text needs.
import { readFileSync } from "node:fs";
import path from "node:path";
import { Font } from "@react-pdf/renderer";
import { woffToSfnt } from "./woff";

const WEIGHTS = [400, 700] as const;

const modules = (...parts: string[]) => path.join(process.cwd(), "node_modules", ...parts);

const INTER = "Sheet Inter";
const interFile = (weight: number) =>
  modules("inter-ui", "Inter (web)", weight === 700 ? "Inter-Bold.woff" : "Inter-Regular.woff");

const CJK_PKG = ["@fontsource", "noto-sans-sc"];
// The package's table names the numbered slices "[12]"; the file names say "12".
const cjkFile = (slice: string, weight: number) =>
  modules(...CJK_PKG, "files", `noto-sans-sc-${slice.replace(/[[\]]/g, "")}-${weight}-normal.woff`);

const sfnts = new Map<string, Buffer>();

/** The sfnt inside a WOFF file of the packages, read and inflated once per process. */
function sfntOf(file: string): Buffer {
  let sfnt = sfnts.get(file);
  if (!sfnt) {
    let woff: Buffer;
    try {
      woff = readFileSync(file);
    } catch {
      throw new Error(`The build sheet's typeface is missing (${file}); install the app's dependencies.`);
    }
    sfnt = woffToSfnt(woff);
    sfnts.set(file, sfnt);
  }
  return sfnt;
}

/** Inter's regular and bold as the sheet embeds them, for a baseline that writes the same text without react-pdf (bench). */
export const interFontData = () => ({ regular: sfntOf(interFile(400)), bold: sfntOf(interFile(700)) });

/** The families the sheet's own words and figures are set in (charts, schematic): µ and Ω included. */
export const LABEL_FONTS = [INTER];

type Slice = { name: string; family: string; ranges: [number, number][] };

function parseRanges(css: string): [number, number][] {
  return css.split(",").map((part) => {
    const [lo, hi] = part.trim().replace(/^U\+/i, "").split("-");
    const a = parseInt(lo ?? "", 16);
    return [a, hi ? parseInt(hi, 16) : a];
  });
}

let cjkSlices: Slice[] | undefined;

/** Noto Sans SC's numbered slices, read once from the package's own unicode-range table. */
function slices(): Slice[] {
  if (cjkSlices) return cjkSlices;
  const table = modules(...CJK_PKG, "unicode.json");
  let ranges: Record<string, string>;
  try {
    ranges = JSON.parse(readFileSync(table, "utf8")) as Record<string, string>;
  } catch {
    throw new Error(`The build sheet's CJK typeface is missing (${table}); install the app's dependencies.`);
  }
  // Its latin, cyrillic, ... slices are Inter's job; only the numbered ones hold CJK.
  cjkSlices = Object.entries(ranges)
    .filter(([name]) => name.startsWith("["))
    .map(([name, css]) => ({ name, family: `Sheet CJK ${name}`, ranges: parseRanges(css) }));
  return cjkSlices;
}

function register(family: string, file: (weight: number) => string) {
  // Asked of react-pdf itself: a module reload in development gives it a fresh, empty registry.
  if (Font.getRegisteredFontFamilies().includes(family)) return;
  Font.register({
    family,
    fonts: WEIGHTS.map((fontWeight) => ({
      src: `data:font/sfnt;base64,${sfntOf(file(fontWeight)).toString("base64")}`,
      fontWeight,
    })),
  });
}

/**
 * The family list for a sheet whose text is `text`: Inter, then the CJK slices that hold one of
 * its non-ASCII characters, in the package's order (a slice listed for a character Inter has is
 * loaded but never used). Registers the families it names. A character no family holds is drawn
 * as Inter's missing-glyph box.
 */
export function sheetFonts(text: string): string[] {
  register(INTER, interFile);
  const all = slices();
  const picked = new Set<Slice>();
  for (const ch of new Set(text)) {
    const cp = ch.codePointAt(0) ?? 0;
    if (cp < 0x80) continue;
    const slice = all.find((s) => s.ranges.some(([lo, hi]) => cp >= lo && cp <= hi));
    if (slice) picked.add(slice);
  }
  const cjk = all.filter((s) => picked.has(s));
  cjk.forEach((s) => register(s.family, (w) => cjkFile(s.name, w)));
  return [INTER, ...cjk.map((s) => s.family)];
}

/** Longest run of characters kept on one line; longer runs may break between characters. */
const LONGEST_UNBROKEN = 16;
const wide = /[\p{Script=Han}\p{Script=Hiragana}\p{Script=Katakana}\p{Script=Hangul}]/u;
const scriptOf = (ch: string) =>
  /\p{Script=Latin}/u.test(ch)
    ? "latin"
    : /\p{Script=Greek}/u.test(ch)
      ? "greek"
      : /\p{Script=Cyrillic}/u.test(ch)
        ? "cyrillic"
        : null;
/** Two neighbours written in different alphabets (digits, signs and µ belong to none). */
const scriptChanges = (a: string, b: string) => {
  const [x, y] = [scriptOf(a), scriptOf(b)];
  return x !== null && y !== null && x !== y;
};

/**
 * Where react-pdf may break a word, as the parts between break points. Ordinary words and values
 * are never split (a part number or a figure cut in two is a misreading); CJK text, which has no
 * spaces, may break before and after each character, and a run longer than any such word (a name
 * typed without spaces) where its script changes and every few characters.
 *
 * Every break point is an empty part, never a hyphenation point: react-pdf sets a hyphen at a
 * hyphenation point it breaks at, in the font of the text before it, so "测试" would print as
 * "测" + a missing-glyph box and a name would not read back as typed. An empty part is a
 * zero-width space to its line breaker (textkit's getNodes: a blank syllable is glue, and no
 * hyphen penalty follows a syllable whose successor is empty). A CJK character is also fenced
 * at the word's ends, because a change of font between runs is otherwise a hyphenation point.
 */
export function breakPoints(word: string): string[] {
  const chars = [...word];
  const long = chars.length > LONGEST_UNBROKEN;
  if (!long && !wide.test(word)) return [word];
  const parts: string[] = [];
  let run = "";
  let count = 0;
  const cut = () => {
    if (run) parts.push(run, "");
    else if (parts.at(-1) !== "") parts.push("");
    run = "";
    count = 0;
  };
  chars.forEach((ch, i) => {
    const previous = chars[i - 1];
    if (wide.test(ch) || (long && previous !== undefined && scriptChanges(previous, ch))) cut();
    run += ch;
    count += 1;
    if (wide.test(ch) || (long && count >= LONGEST_UNBROKEN / 2)) cut();
  });
  if (run) parts.push(run);
  return parts;
}
