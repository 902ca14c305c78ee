import { describe, expect, it } from "vitest";
import { freeName } from "./free-name";

describe("freeName", () => {
  it("numbers from 2 and skips taken numbers, ignoring case", () => {
    expect(freeName("Pump monitor", ["Pump monitor"])).toBe("Pump monitor (2)");
    expect(freeName("Pump monitor", ["pump monitor", "PUMP MONITOR (2)"])).toBe("Pump monitor (3)");
  });
  it("stays within the 200-character limit", () => {
    expect(freeName("x".repeat(200), ["x".repeat(200)])).toHaveLength(200);
  });
});
