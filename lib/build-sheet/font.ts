// The build sheet's typeface, embedded in every PDF. The only copy of Inter the app ships is
// the WOFF2 variable font from @fontsource-variable/inter, and react-pdf's subsetter cannot
// read WOFF2 glyph data (it crashes on composite glyphs). So, once per process, we rebuild a
// plain static TrueType font from it: the Latin and Greek subsets merged (µ is Latin, Ω is
// Greek), every glyph flattened to simple outlines at the default weight (400), and a bold
// face made by growing the outlines (the way a rasteriser emboldens), since the WOFF2
// variation data cannot be applied here either.
import { readFileSync } from "node:fs";
import path from "node:path";
import * as fontkit from "fontkit";

type Pt = { x: number; y: number; on: boolean };
type Contour = Pt[];
type SourceGlyph = { contours: Contour[]; advance: number };

// fontkit's public types stop short of what we read here.
type FkPoint = { x: number; y: number; onCurve: boolean };
type FkGlyph = { _getContours(): FkPoint[][]; advanceWidth: number };
type FkTableEntry = { offset: number; length: number; transformed?: boolean };
type FkFont = {
  characterSet: number[];
  glyphForCodePoint(cp: number): { id: number };
  getGlyph(id: number): FkGlyph;
  directory: { tables: Record<string, FkTableEntry> };
  stream: { buffer: Uint8Array };
  _decompress?: () => void;
  _getTableStream(tag: string): unknown;
  name: { records: Record<string, Record<string, string> | undefined> };
};

const FONT_DIR = ["node_modules", "@fontsource-variable", "inter", "files"];
const SUBSETS = ["latin", "greek"] as const;

/** Outline growth of the bold face, em units (2048 per em): about semibold. */
const BOLD_STRENGTH = 42;

function fontFile(subset: string): string {
  return path.join(process.cwd(), ...FONT_DIR, `inter-${subset}-wght-normal.woff2`);
}

function openSource(subset: string): FkFont {
  const file = fontFile(subset);
  let bytes: Buffer;
  try {
    bytes = readFileSync(file);
  } catch {
    throw new Error(
      `The build sheet's typeface is missing (${file}); start the app from its own directory with its dependencies installed.`,
    );
  }
  return fontkit.create(bytes) as unknown as FkFont;
}

function rawTable(font: FkFont, tag: string): Uint8Array {
  font._getTableStream(tag); // decompresses the WOFF2 data on first use
  const entry = font.directory.tables[tag];
  if (!entry || entry.transformed) throw new Error(`font table ${tag} is missing or transformed`);
  return font.stream.buffer.slice(entry.offset, entry.offset + entry.length);
}

function readGlyph(font: FkFont, id: number): SourceGlyph {
  const g = font.getGlyph(id);
  const contours = g
    ._getContours()
    .map((c) => c.map((p) => ({ x: p.x, y: p.y, on: p.onCurve })))
    .filter((c) => c.length > 0);
  return { contours, advance: g.advanceWidth };
}

/** Moves every point outward along its corner's miter by `d` (outer contours run clockwise). */
function embolden(contours: Contour[], d: number): Contour[] {
  return contours.map((c) => {
    return c.map((p, i) => {
      const prev = distinctNeighbour(c, i, -1);
      const next = distinctNeighbour(c, i, 1);
      if (!prev || !next) return { ...p, x: p.x + d };
      const n1 = normal(prev, p);
      const n2 = normal(p, next);
      const dot = n1.x * n2.x + n1.y * n2.y;
      // Miter length 1/cos(θ/2); clamp sharp corners so spikes do not form.
      const k = Math.min(2, 1 / Math.max(0.25, (1 + dot) / 2)) / 2;
      const mx = (n1.x + n2.x) * k;
      const my = (n1.y + n2.y) * k;
      return { x: p.x + d + d * mx, y: p.y + d * my, on: p.on };
    });
  });
}

function distinctNeighbour(c: Contour, i: number, step: 1 | -1): Pt | null {
  const n = c.length;
  const p = c[i]!;
  for (let k = 1; k < n; k++) {
    const q = c[(i + step * k + n * k) % n]!;
    if (q.x !== p.x || q.y !== p.y) return q;
  }
  return null;
}

/** Unit normal to the left of a→b (outward for a clockwise contour in y-up units). */
function normal(a: Pt, b: Pt): { x: number; y: number } {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const len = Math.hypot(dx, dy) || 1;
  return { x: -dy / len, y: dx / len };
}

class Writer {
  private buf = new Uint8Array(1024);
  private n = 0;
  private room(k: number) {
    if (this.n + k <= this.buf.length) return;
    const next = new Uint8Array(Math.max(this.buf.length * 2, this.n + k));
    next.set(this.buf.subarray(0, this.n));
    this.buf = next;
  }
  u8(v: number) {
    this.room(1);
    this.buf[this.n++] = v & 0xff;
  }
  u16(v: number) {
    this.room(2);
    this.buf[this.n++] = (v >> 8) & 0xff;
    this.buf[this.n++] = v & 0xff;
  }
  i16(v: number) {
    this.u16(v < 0 ? v + 0x10000 : v);
  }
  u32(v: number) {
    this.u16(Math.floor(v / 0x10000) & 0xffff);
    this.u16(v & 0xffff);
  }
  raw(b: Uint8Array) {
    this.room(b.length);
    this.buf.set(b, this.n);
    this.n += b.length;
  }
  pad4() {
    while (this.n % 4) this.u8(0);
  }
  get length() {
    return this.n;
  }
  done(): Uint8Array {
    return this.buf.slice(0, this.n);
  }
}

type Bbox = { xMin: number; yMin: number; xMax: number; yMax: number };

function encodeSimpleGlyph(contours: Contour[]): { data: Uint8Array; bbox: Bbox | null; points: number } {
  const pts = contours.flat().map((p) => ({ x: Math.round(p.x), y: Math.round(p.y), on: p.on }));
  if (pts.length === 0) return { data: new Uint8Array(0), bbox: null, points: 0 };
  const bbox = { xMin: Infinity, yMin: Infinity, xMax: -Infinity, yMax: -Infinity };
  for (const p of pts) {
    bbox.xMin = Math.min(bbox.xMin, p.x);
    bbox.yMin = Math.min(bbox.yMin, p.y);
    bbox.xMax = Math.max(bbox.xMax, p.x);
    bbox.yMax = Math.max(bbox.yMax, p.y);
  }
  const w = new Writer();
  w.i16(contours.length);
  w.i16(bbox.xMin);
  w.i16(bbox.yMin);
  w.i16(bbox.xMax);
  w.i16(bbox.yMax);
  let end = -1;
  for (const c of contours) {
    end += c.length;
    w.u16(end);
  }
  w.u16(0); // no hinting instructions
  const flags: number[] = [];
  const xs: number[] = [];
  const ys: number[] = [];
  let lx = 0;
  let ly = 0;
  for (const p of pts) {
    let f = p.on ? 1 : 0;
    const dx = p.x - lx;
    const dy = p.y - ly;
    if (dx === 0) f |= 0x10;
    else if (Math.abs(dx) < 256) {
      f |= 0x02 | (dx > 0 ? 0x10 : 0);
      xs.push(Math.abs(dx));
    } else xs.push(dx, NaN); // NaN marks a 16-bit value
    if (dy === 0) f |= 0x20;
    else if (Math.abs(dy) < 256) {
      f |= 0x04 | (dy > 0 ? 0x20 : 0);
      ys.push(Math.abs(dy));
    } else ys.push(dy, NaN);
    flags.push(f);
    lx = p.x;
    ly = p.y;
  }
  for (const f of flags) w.u8(f);
  for (const list of [xs, ys]) {
    for (let i = 0; i < list.length; i++) {
      if (Number.isNaN(list[i + 1])) {
        w.i16(list[i]!);
        i++;
      } else w.u8(list[i]!);
    }
  }
  while (w.length % 4) w.u8(0);
  return { data: w.done(), bbox, points: pts.length };
}

function encodeCmap(map: Map<number, number>): Uint8Array {
  const codes = [...map.keys()].filter((c) => c < 0xffff).sort((a, b) => a - b);
  const segs: { start: number; end: number; delta: number }[] = [];
  for (const c of codes) {
    const gid = map.get(c)!;
    const last = segs[segs.length - 1];
    if (last && c === last.end + 1 && ((gid - c) & 0xffff) === last.delta) last.end = c;
    else segs.push({ start: c, end: c, delta: (gid - c) & 0xffff });
  }
  segs.push({ start: 0xffff, end: 0xffff, delta: 1 });
  const segX2 = segs.length * 2;
  const pow = 2 ** Math.floor(Math.log2(segs.length));
  const w = new Writer();
  w.u16(0); // version
  w.u16(1); // one subtable
  w.u16(3); // Windows
  w.u16(1); // Unicode BMP
  w.u32(12);
  w.u16(4); // format
  w.u16(16 + segs.length * 8);
  w.u16(0);
  w.u16(segX2);
  w.u16(pow * 2);
  w.u16(Math.log2(pow));
  w.u16(segX2 - pow * 2);
  for (const s of segs) w.u16(s.end);
  w.u16(0);
  for (const s of segs) w.u16(s.start);
  for (const s of segs) w.u16(s.delta);
  for (const _ of segs) w.u16(0);
  return w.done();
}

/**
 * A name table of our own: each face needs a distinct PostScript name, or the PDF writer
 * mistakes one face for the other and embeds a fresh copy of the font for every run of text.
 * The original copyright and licence lines are kept (the SIL Open Font License asks for them).
 */
function encodeName(base: FkFont, bold: boolean): Uint8Array {
  const r = base.name.records;
  const style = bold ? "Bold" : "Regular";
  const records: [number, string][] = [
    [0, r.copyright?.en ?? "Copyright 2016 The Inter Project Authors"],
    [1, "Sensewright Sheet"],
    [2, style],
    [3, `Sensewright Sheet ${style}; derived from Inter`],
    [4, `Sensewright Sheet ${style}`],
    [5, "Version 1.0"],
    [6, `SensewrightSheet-${style}`],
    [13, r.license?.en ?? "This Font Software is licensed under the SIL Open Font License, Version 1.1."],
    [14, r.licenseURL?.en ?? "https://openfontlicense.org"],
  ];
  const strings = records.map(([, text]) => {
    const b = new Uint8Array(text.length * 2);
    for (let i = 0; i < text.length; i++) {
      b[2 * i] = text.charCodeAt(i) >> 8;
      b[2 * i + 1] = text.charCodeAt(i) & 0xff;
    }
    return b;
  });
  const w = new Writer();
  w.u16(0);
  w.u16(records.length);
  w.u16(6 + records.length * 12);
  let offset = 0;
  records.forEach(([id], i) => {
    w.u16(3); // Windows
    w.u16(1); // Unicode BMP
    w.u16(0x409); // English (US)
    w.u16(id);
    w.u16(strings[i]!.length);
    w.u16(offset);
    offset += strings[i]!.length;
  });
  for (const b of strings) w.raw(b);
  return w.done();
}

function patch16(t: Uint8Array, at: number, v: number) {
  const u = v < 0 ? v + 0x10000 : v;
  t[at] = (u >> 8) & 0xff;
  t[at + 1] = u & 0xff;
}

function checksum(b: Uint8Array): number {
  let sum = 0;
  for (let i = 0; i < b.length; i += 4) {
    sum =
      (sum + (((b[i] ?? 0) << 24) >>> 0) + ((b[i + 1] ?? 0) << 16) + ((b[i + 2] ?? 0) << 8) + (b[i + 3] ?? 0)) >>> 0;
  }
  return sum;
}

type Source = { base: FkFont; glyphs: SourceGlyph[]; cmap: Map<number, number> };

/** Glyph 0 is .notdef; then one glyph per character, the first subset that has it winning. */
function readSources(): Source {
  const sources = SUBSETS.map(openSource);
  const base = sources[0]!;
  const glyphs: SourceGlyph[] = [readGlyph(base, 0)];
  const cmap = new Map<number, number>();
  for (const font of sources) {
    for (const cp of [...font.characterSet].sort((a, b) => a - b)) {
      if (cmap.has(cp)) continue;
      cmap.set(cp, glyphs.length);
      glyphs.push(readGlyph(font, font.glyphForCodePoint(cp).id));
    }
  }
  return { base, glyphs, cmap };
}

function buildTtf({ base, glyphs, cmap }: Source, bold: boolean): Uint8Array {
  const glyf = new Writer();
  const loca: number[] = [];
  const hmtx = new Writer();
  let maxPoints = 0;
  let maxContours = 0;
  let advanceMax = 0;
  const box = { xMin: Infinity, yMin: Infinity, xMax: -Infinity, yMax: -Infinity };
  for (const g of glyphs) {
    const contours = bold ? embolden(g.contours, BOLD_STRENGTH) : g.contours;
    const advance = Math.round(g.advance + (bold && g.contours.length ? 2 * BOLD_STRENGTH : 0));
    const enc = encodeSimpleGlyph(contours);
    loca.push(glyf.length);
    glyf.raw(enc.data);
    hmtx.u16(advance);
    hmtx.i16(enc.bbox ? enc.bbox.xMin : 0);
    advanceMax = Math.max(advanceMax, advance);
    maxPoints = Math.max(maxPoints, enc.points);
    maxContours = Math.max(maxContours, contours.length);
    if (enc.bbox) {
      box.xMin = Math.min(box.xMin, enc.bbox.xMin);
      box.yMin = Math.min(box.yMin, enc.bbox.yMin);
      box.xMax = Math.max(box.xMax, enc.bbox.xMax);
      box.yMax = Math.max(box.yMax, enc.bbox.yMax);
    }
  }
  loca.push(glyf.length);
  const locaW = new Writer();
  for (const o of loca) locaW.u32(o);

  const head = rawTable(base, "head");
  patch16(head, 8, 0);
  patch16(head, 10, 0); // checkSumAdjustment, set below
  patch16(head, 36, box.xMin);
  patch16(head, 38, box.yMin);
  patch16(head, 40, box.xMax);
  patch16(head, 42, box.yMax);
  patch16(head, 44, bold ? 1 : 0); // macStyle
  patch16(head, 50, 1); // long loca offsets
  const hhea = rawTable(base, "hhea");
  patch16(hhea, 10, advanceMax);
  patch16(hhea, 34, glyphs.length);
  const maxp = rawTable(base, "maxp");
  patch16(maxp, 4, glyphs.length);
  patch16(maxp, 6, maxPoints);
  patch16(maxp, 8, maxContours);
  for (const at of [10, 12, 28, 30]) patch16(maxp, at, 0); // no composites left
  const os2 = rawTable(base, "OS/2");
  patch16(os2, 4, bold ? 700 : 400);
  patch16(os2, 62, bold ? 0x20 : 0x40);
  const post = rawTable(base, "post").slice(0, 32);
  patch16(post, 0, 3); // version 3: no glyph names
  patch16(post, 2, 0);

  const tables: Record<string, Uint8Array> = {
    "OS/2": os2,
    cmap: encodeCmap(cmap),
    glyf: glyf.done(),
    head,
    hhea,
    hmtx: hmtx.done(),
    loca: locaW.done(),
    maxp,
    name: encodeName(base, bold),
    post,
  };
  const tags = Object.keys(tables).sort();
  const out = new Writer();
  const pow = 2 ** Math.floor(Math.log2(tags.length));
  out.u32(0x00010000);
  out.u16(tags.length);
  out.u16(pow * 16);
  out.u16(Math.log2(pow));
  out.u16(tags.length * 16 - pow * 16);
  let offset = 12 + tags.length * 16;
  const bodies: Uint8Array[] = [];
  for (const tag of tags) {
    const t = tables[tag]!;
    for (const ch of tag.padEnd(4, " ")) out.u8(ch.charCodeAt(0));
    out.u32(checksum(t));
    out.u32(offset);
    out.u32(t.length);
    offset += Math.ceil(t.length / 4) * 4;
    bodies.push(t);
  }
  for (const b of bodies) {
    out.raw(b);
    out.pad4();
  }
  const font = out.done();
  const adjust = (0xb1b0afba - checksum(font)) >>> 0;
  const headAt =
    12 +
    tags.length * 16 +
    tags.slice(0, tags.indexOf("head")).reduce((s, t) => s + Math.ceil(tables[t]!.length / 4) * 4, 0);
  font[headAt + 8] = adjust >>> 24;
  font[headAt + 9] = (adjust >>> 16) & 0xff;
  font[headAt + 10] = (adjust >>> 8) & 0xff;
  font[headAt + 11] = adjust & 0xff;
  return font;
}

export type SheetFonts = { regular: Uint8Array; bold: Uint8Array };

const cache = globalThis as unknown as { __sensewrightSheetFonts?: SheetFonts };

/** The two faces as TrueType bytes, built once per process. */
export function sheetFonts(): SheetFonts {
  if (!cache.__sensewrightSheetFonts) {
    const source = readSources();
    cache.__sensewrightSheetFonts = { regular: buildTtf(source, false), bold: buildTtf(source, true) };
  }
  return cache.__sensewrightSheetFonts;
}

/** The characters the sheet's typeface can draw (a test checks every sheet's text against it). */
export function coveredCodePoints(): Set<number> {
  const set = new Set<number>();
  for (const font of SUBSETS.map(openSource)) for (const cp of font.characterSet) set.add(cp);
  return set;
}
