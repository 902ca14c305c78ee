import { describe, expect, it } from "vitest";
import { buildNetlist, spiceNumber } from "./netlist";
import { req } from "./test-helpers";

const base = { current: { min: "1 mA", max: "180 mA" }, supply: { voltage: "3 V" }, drop: { max: "60 mV" } } as const;

describe("netlist", () => {
  it("writes numbers without SPICE scale suffixes", () => {
    expect(spiceNumber(4.7e-3)).toBe("4.7e-3");
    expect(spiceNumber(3)).toBe("3");
    expect(spiceNumber(1e6)).toBe("1e6");
    expect(spiceNumber(0.18)).toBe("1.8e-1");
    expect(() => spiceNumber(NaN)).toThrow();
  });
  it("low side: load from bus to sp, shunt sp→sn, sn returned to ground through a 0 V source", () => {
    const n = buildNetlist(req(base), { shuntOhms: 0.274, gain: 50 });
    const lines = n.split("\n");
    expect(lines).toContain("VBUS bus 0 DC 3");
    expect(lines).toContain("RSHUNT sp sn 2.74e-1");
    expect(lines).toContain("VRET sn 0 DC 0");
    expect(lines).toContain("ILOAD bus sp DC 1.8e-1");
    expect(lines).toContain("VOS spo sp DC 1e-5");
    expect(lines).toContain("EAMP out 0 spo sn 5e1");
    expect(lines).toContain(".op");
    expect(lines.filter((l) => l.trim() !== "").at(-1)).toBe(".end");
    expect(n).not.toMatch(/\d[mMkunp]\b/); // no scale suffixes on numbers
  });
  it("high side puts the load after the shunt; resistive and constant-power loads are modelled", () => {
    const high = buildNetlist(
      req({ ...base, supply: { voltage: "24 V", side: "high" }, load: { model: "resistive" } }),
      { shuntOhms: 0.01, gain: 20 },
    );
    expect(high).toContain("VFEED bus sp DC 0");
    expect(high).toContain("RLOAD sn 0 1.333333333e2");
    const cp = buildNetlist(req({ ...base, load: { model: "constant-power" } }), { shuntOhms: 0.1, gain: 20 });
    expect(cp).toMatch(/^BLOAD bus sp I=5\.4e-1\/max\(V\(bus,sp\),3e-3\)$/m);
  });
  it("leaves the offset out when asked", () => {
    const n = buildNetlist(req(base), { shuntOhms: 0.274, gain: 50 }, { includeOffset: false });
    expect(n).not.toContain("VOS");
    expect(n).toContain("EAMP out 0 sp sn 5e1");
  });
});
