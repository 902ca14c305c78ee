// WOFF 1.0 to a plain sfnt (TrueType/OpenType) file, as the W3C WOFF 1.0 recommendation's
// "Decoding" section describes it: the same tables, each inflated when it was compressed, behind a
// rebuilt sfnt header and table directory.
//
// Why: the sheet's typefaces come from npm as WOFF, and fontkit (under react-pdf) inflates a WOFF
// table again on every read of it. Subsetting reads the glyph table once per glyph, so a four-page
// sheet spent two thirds of its second in zlib. An sfnt is read in place.
import { inflateSync } from "node:zlib";

const WOFF_HEADER = 44;
const WOFF_ENTRY = 20;
const SFNT_HEADER = 12;
const SFNT_ENTRY = 16;

type Table = { tag: number; offset: number; compLength: number; origLength: number; origChecksum: number };

const pad4 = (n: number) => (n + 3) & ~3;

/** The sfnt a WOFF 1.0 file holds; throws on anything else or on a table that does not inflate to its stated length. */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.length < WOFF_HEADER || woff.toString("latin1", 0, 4) !== "wOFF")
    throw new Error("not a WOFF 1.0 file (its first four bytes are not 'wOFF')");
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables: Table[] = [];
  for (let i = 0; i < numTables; i++) {
    const at = WOFF_HEADER + i * WOFF_ENTRY;
    tables.push({
      tag: woff.readUInt32BE(at),
      offset: woff.readUInt32BE(at + 4),
      compLength: woff.readUInt32BE(at + 8),
      origLength: woff.readUInt32BE(at + 12),
      origChecksum: woff.readUInt32BE(at + 16),
    });
  }
  // Table data keeps the WOFF file's order; the directory is sorted by tag (the OpenType rule).
  const inFileOrder = [...tables].sort((a, b) => a.offset - b.offset);
  let size = SFNT_HEADER + SFNT_ENTRY * numTables;
  const placed = new Map<Table, number>();
  for (const t of inFileOrder) {
    placed.set(t, size);
    size += pad4(t.origLength);
  }
  const out = Buffer.alloc(size); // zero-filled, so the padding is zeros
  // searchRange etc.: the largest power of two not above numTables, as the OpenType spec defines them.
  const power = numTables > 0 ? 2 ** Math.floor(Math.log2(numTables)) : 0;
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(power * 16, 6);
  out.writeUInt16BE(power > 0 ? Math.log2(power) : 0, 8);
  out.writeUInt16BE(numTables * 16 - power * 16, 10);
  [...tables]
    .sort((a, b) => a.tag - b.tag)
    .forEach((t, i) => {
      const at = SFNT_HEADER + i * SFNT_ENTRY;
      out.writeUInt32BE(t.tag, at);
      out.writeUInt32BE(t.origChecksum, at + 4);
      out.writeUInt32BE(placed.get(t)!, at + 8);
      out.writeUInt32BE(t.origLength, at + 12);
    });
  for (const t of inFileOrder) {
    const stored = woff.subarray(t.offset, t.offset + t.compLength);
    const data = t.compLength < t.origLength ? inflateSync(stored) : stored;
    if (data.length !== t.origLength) {
      const tag = Buffer.alloc(4);
      tag.writeUInt32BE(t.tag);
      throw new Error(
        `WOFF table '${tag.toString("latin1")}' holds ${data.length} bytes, not the ${t.origLength} it states`,
      );
    }
    data.copy(out, placed.get(t)!);
  }
  return out;
}
