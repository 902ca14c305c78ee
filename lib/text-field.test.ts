// Issue 10, items 8 and 10: free text that PostgreSQL cannot store is a 422 on its field, and a
// name is one line wherever it is printed.
import { describe, expect, it } from "vitest";
import { namesOnOneLine } from "@/lib/build-sheet/sheet-data";
import { loneSurrogateAt, oneLine, textField } from "./text-field";

const name = textField({ label: "Name", min: 1, max: 20 });
const comment = textField({ label: "Comment", max: 100, multiline: true });
const message = (r: ReturnType<typeof name.safeParse>) => (r.success ? null : r.error.issues[0]!.message);

describe("textField", () => {
  it.each([
    ["a\u0000b", "Name contains a NUL character (U+0000), which cannot be stored"],
    ["\ud800x", "Name contains half of a UTF-16 surrogate pair, which is not valid text"],
    ["x\udfff", "Name contains half of a UTF-16 surrogate pair, which is not valid text"],
    ["bell\u0007", "Name contains the control character U+0007"],
  ])("refuses %j", (input, why) => {
    expect(message(name.safeParse(input))).toBe(why);
  });

  it("keeps whole surrogate pairs, accents and symbols", () => {
    expect(name.safeParse("Strip 4.7 mΩ 😀").success).toBe(true);
    expect(loneSurrogateAt("😀")).toBe(-1);
  });

  it("puts a name on one line and trims it; a comment keeps its lines", () => {
    expect(name.parse("Logger\r\nAPPROVED by x")).toBe("Logger APPROVED by x");
    expect(name.parse(" a\u2028b\u2029c\u0085d ")).toBe("a b c d");
    expect(comment.parse("first\nsecond")).toBe("first\nsecond");
    expect(message(name.safeParse("\n \n"))).toBe("Name is required");
    expect(message(name.safeParse("x".repeat(21)))).toBe("Name: at most 20 characters");
  });

  it("oneLine collapses every kind of line break", () => {
    expect(oneLine("a\rb\nc\u000bd\u000ce")).toBe("a b c d e");
  });
});

describe("build sheet names", () => {
  it("print on one line, the approver's too", () => {
    const view = namesOnOneLine({
      name: "Logger\nAPPROVED by Chief",
      project: "P\r\nQ",
      authorName: "A\nB",
      approval: { byName: "R\u2028S", at: "2026-11-30T15:42:00.000Z", revision: 1 },
    });
    expect(view).toEqual({
      name: "Logger APPROVED by Chief",
      project: "P Q",
      authorName: "A B",
      approval: { byName: "R S", at: "2026-11-30T15:42:00.000Z", revision: 1 },
    });
  });
});
