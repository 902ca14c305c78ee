// The hex codec against PostgreSQL itself (md5() and length() of what it stored, octet_length in
// the manual's §9.5) and against PGlite's own codec (the same text both ways).
import { createHash, randomBytes } from "node:crypto";
import { PGlite, types } from "@electric-sql/pglite";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { byteaFromHex, byteaParsers, byteaSerializers, byteaToHex } from "./bytea";

let db: PGlite;
beforeAll(async () => {
  db = new PGlite({ parsers: byteaParsers, serializers: byteaSerializers });
  await db.exec("create table blobs (id int primary key, b bytea not null)");
});
afterAll(() => db.close());

const samples = [new Uint8Array(0), Uint8Array.of(0, 1, 127, 128, 255), new Uint8Array(randomBytes(100_003))];

describe("bytea hex codec", () => {
  it("writes and reads the same text as PGlite's own codec", () => {
    for (const bytes of samples) {
      const text = byteaToHex(bytes);
      expect(text).toBe(types.serializers[types.BYTEA]!(bytes));
      expect(byteaFromHex(text)).toEqual(types.parsers[types.BYTEA]!(text, types.BYTEA));
    }
    expect(byteaToHex(Uint8Array.of(0x0a, 0xff))).toBe("\\x0aff"); // the manual's own form
  });

  it("stores what PostgreSQL hashes to the same md5, and reads it back byte for byte", async () => {
    for (const [id, bytes] of samples.entries()) {
      await db.query("insert into blobs values ($1, $2)", [id, bytes]);
      const [row] = (
        await db.query<{ n: number; md5: string; b: Uint8Array }>(
          "select octet_length(b) as n, md5(b) as md5, b from blobs where id = $1",
          [id],
        )
      ).rows;
      expect(row!.n).toBe(bytes.length);
      expect(row!.md5).toBe(createHash("md5").update(bytes).digest("hex"));
      expect(row!.b).toEqual(bytes);
    }
  });

  it("writes a view into a larger buffer as just its own bytes", () => {
    const whole = Uint8Array.of(9, 9, 1, 2, 3, 9);
    expect(byteaToHex(whole.subarray(2, 5))).toBe("\\x010203");
  });

  it("reads into an array of its own, not a slice of a shared pool", () => {
    const read = byteaFromHex("\\x010203");
    expect(read.byteOffset).toBe(0);
    expect(read.buffer.byteLength).toBe(3);
  });

  it("refuses what it cannot read rather than guessing", () => {
    expect(() => byteaFromHex("abc")).toThrow(/escape format/);
    expect(() => byteaToHex("abc" as unknown as Uint8Array)).toThrow(/Uint8Array/);
  });
});
