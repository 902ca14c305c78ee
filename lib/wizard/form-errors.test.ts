// Stock schema messages are reworded in the field's own words (issue 12 item 7).
import { describe, expect, it } from "vitest";
import { engineErrorsFor, errorPaths, inWords } from "./form-errors";

describe("inWords", () => {
  it("quotes the list entry at fault with the field's label", () => {
    expect(inWords("amplifier.gains.1", "Invalid input: expected number, received string", "abc")).toBe(
      "Gains swept: “abc” is not a number; give numbers separated by commas",
    );
    expect(inWords("amplifier.gains", "Invalid input: expected number, received string", [10, "abc"])).toBe(
      "Gains swept: “abc” is not a number",
    );
  });
  it("leaves the engine's own messages as they are", () => {
    expect(inWords("current.max", "Maximum current: 5 V is a voltage, not a current")).toBe(
      "Maximum current: 5 V is a voltage, not a current",
    );
  });
});

describe("errorPaths", () => {
  it("lists fields with messages, a list as its own path", () => {
    expect(
      errorPaths({
        current: { max: { type: "custom", message: "x" } },
        amplifier: { gains: { 1: { type: "x", message: "y" } } },
      } as never),
    ).toEqual(["current.max", "amplifier.gains"]);
  });
  it("says a word in a list of numbers is not a number, from the list's stock message", () => {
    expect(inWords("amplifier.gains", "Invalid input", [10, "abc"])).toBe(
      "Gains swept: “abc” is not a number; give numbers separated by commas",
    );
  });
  it("quotes the typed entry in the live solve's message for a list", () => {
    expect(
      engineErrorsFor({ "amplifier.gains.1": ["Invalid input"] }, "amplifier.gains", {
        amplifier: { gains: [10, "abc"] },
      }),
    ).toBe("Gains swept: “abc” is not a number; give numbers separated by commas");
  });
});
