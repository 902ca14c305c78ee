// The build sheet's WOFF-to-sfnt step (lib/build-sheet/woff.ts), checked against the W3C WOFF 1.0
// recommendation (the header's totalSfntSize, each table's origChecksum), the OpenType spec's table
// checksum, and fontkit (the font library react-pdf uses) reading the same glyphs from both files.
import { readFileSync } from "node:fs";
import path from "node:path";
import { deflateSync } from "node:zlib";
import { create, type Font } from "fontkit";
import { describe, expect, it } from "vitest";
import { woffToSfnt } from "@/lib/build-sheet/woff";

const inter = (name: string) => readFileSync(path.join("node_modules", "inter-ui", "Inter (web)", name));

/** OpenType spec, "Calculating checksums": the sum of big-endian uint32 words, zero-padded, mod 2³². */
function checksum(data: Buffer): number {
  let sum = 0;
  for (let i = 0; i < data.length; i += 4) {
    const word = ((data[i] ?? 0) << 24) | ((data[i + 1] ?? 0) << 16) | ((data[i + 2] ?? 0) << 8) | (data[i + 3] ?? 0);
    sum = (sum + (word >>> 0)) >>> 0;
  }
  return sum;
}

type Entry = { tag: string; checksum: number; offset: number; length: number };

/** An sfnt's table directory (OpenType spec, "Table directory"). */
function directory(sfnt: Buffer): Entry[] {
  return Array.from({ length: sfnt.readUInt16BE(4) }, (_, i) => {
    const at = 12 + 16 * i;
    return {
      tag: sfnt.toString("latin1", at, at + 4),
      checksum: sfnt.readUInt32BE(at + 4),
      offset: sfnt.readUInt32BE(at + 8),
      length: sfnt.readUInt32BE(at + 12),
    };
  });
}

describe("woffToSfnt", () => {
  for (const file of ["Inter-Regular.woff", "Inter-Bold.woff"]) {
    describe(file, () => {
      const woff = inter(file);
      const sfnt = woffToSfnt(woff);

      it("is as long as the WOFF header's totalSfntSize says (WOFF 1.0 §3)", () => {
        expect(sfnt.length).toBe(woff.readUInt32BE(16));
      });

      it("keeps the flavor and writes searchRange, entrySelector and rangeShift as OpenType defines them", () => {
        const n = sfnt.readUInt16BE(4);
        expect(sfnt.readUInt32BE(0)).toBe(woff.readUInt32BE(4));
        expect(n).toBe(woff.readUInt16BE(12));
        const power = 2 ** Math.floor(Math.log2(n));
        expect(sfnt.readUInt16BE(6)).toBe(power * 16);
        expect(sfnt.readUInt16BE(8)).toBe(Math.log2(power));
        expect(sfnt.readUInt16BE(10)).toBe(n * 16 - power * 16);
      });

      it("lists tables by tag, 4-byte aligned, each with the checksum its bytes have (head with its adjustment zeroed)", () => {
        const tables = directory(sfnt);
        expect(tables.map((t) => t.tag)).toEqual([...tables.map((t) => t.tag)].sort());
        for (const t of tables) {
          expect(t.offset % 4, t.tag).toBe(0);
          const bytes = Buffer.from(sfnt.subarray(t.offset, t.offset + t.length));
          if (t.tag === "head") bytes.writeUInt32BE(0, 8); // checkSumAdjustment
          expect(checksum(bytes), t.tag).toBe(t.checksum);
        }
      });

      it("sums, as a whole file, to the OpenType magic number 0xB1B0AFBA (head's checkSumAdjustment)", () => {
        expect(checksum(sfnt)).toBe(0xb1b0afba);
      });

      it("reads in fontkit as the same font with the same glyphs and advances as the WOFF", () => {
        const a = create(woff) as Font;
        const b = create(sfnt) as Font;
        expect(b.postscriptName).toBe(a.postscriptName);
        expect(b.numGlyphs).toBe(a.numGlyphs);
        const text = "Shunt 4.7 mΩ, gain 50 V/V, ±0.5 % at 25 °C, 38 µV/√Hz";
        const [ra, rb] = [a.layout(text), b.layout(text)];
        expect(rb.glyphs.map((g) => g.id)).toEqual(ra.glyphs.map((g) => g.id));
        expect(rb.positions.map((p) => p.xAdvance)).toEqual(ra.positions.map((p) => p.xAdvance));
        expect(rb.glyphs.map((g) => g.path.toSVG())).toEqual(ra.glyphs.map((g) => g.path.toSVG()));
      });
    });
  }

  it("refuses a file that is not WOFF 1.0, saying so", () => {
    expect(() => woffToSfnt(inter("Inter-Regular.woff2"))).toThrow(/not a WOFF 1\.0 file/);
    expect(() => woffToSfnt(Buffer.from("wOF"))).toThrow(/not a WOFF 1\.0 file/);
  });

  it("refuses a table that does not inflate to the length it states, naming the table", () => {
    // A one-table WOFF whose 'name' table claims 100 bytes but inflates to 50.
    const data = deflateSync(Buffer.alloc(50, 7));
    const woff = Buffer.alloc(44 + 20 + data.length);
    woff.write("wOFF", 0, "latin1");
    woff.writeUInt32BE(0x00010000, 4);
    woff.writeUInt32BE(woff.length, 8);
    woff.writeUInt16BE(1, 12);
    woff.write("name", 44, "latin1");
    woff.writeUInt32BE(64, 48);
    woff.writeUInt32BE(data.length, 52);
    woff.writeUInt32BE(100, 56);
    data.copy(woff, 64);
    expect(() => woffToSfnt(woff)).toThrow(/table 'name' holds 50 bytes, not the 100 it states/);
  });
});
