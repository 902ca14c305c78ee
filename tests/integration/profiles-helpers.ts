// Shared by the profile specs: a saved design built from /api/solve's first feasible candidate.
import { expect, type APIRequestContext } from "@playwright/test";
import { demoLoggerReadout } from "../../lib/design/test-helpers";

/**
 * A span one range covers: 1 mA to 100 mA on 3.3 V, 100 mV allowed, a 12-bit 2.5 V ADC with its own
 * error stated and zeroed once (the demo logger's converter, db/seed/designs.ts).
 */
export const profileRequirement = {
  current: { min: "1 mA", max: "100 mA" },
  supply: { voltage: "3.3 V", side: "low" },
  drop: { max: "100 mV" },
  ...demoLoggerReadout,
  resolution: { countsAtMin: 10 },
};

export type SavedDesign = {
  id: string;
  revision: number;
  requirement: { supply: { voltage: number }; readout: { fullScale: number } };
  choice: { shuntOhms: number; gain: number };
  metrics: { lsbA: number };
};

/** Creates a design as `ctx` (owner or designer) and returns it as GET /api/designs/[id] sends it. */
export async function createProfileDesign(ctx: APIRequestContext, name: string): Promise<SavedDesign> {
  const solved = await ctx.post("/api/solve", { data: profileRequirement });
  expect(solved.status(), await solved.text()).toBe(200);
  const { candidates } = (await solved.json()) as {
    candidates: { shuntOhms: number; gain: number; feasible: boolean }[];
  };
  const choice = candidates.find((c) => c.feasible);
  expect(choice, "a feasible candidate").toBeTruthy();
  const created = await ctx.post("/api/designs", {
    data: {
      name,
      project: "Profile checks",
      requirement: profileRequirement,
      choice: { shuntOhms: choice!.shuntOhms, gain: choice!.gain },
    },
  });
  expect(created.status(), await created.text()).toBe(201);
  const { id } = (await created.json()) as { id: string };
  const got = await ctx.get(`/api/designs/${id}`);
  expect(got.status()).toBe(200);
  return (await got.json()) as SavedDesign;
}

export function uploadCsv(ctx: APIRequestContext, designId: string, name: string, content: string | Buffer) {
  return ctx.post(`/api/designs/${designId}/profiles`, {
    multipart: {
      file: { name, mimeType: "text/csv", buffer: Buffer.isBuffer(content) ? content : Buffer.from(content, "utf8") },
    },
  });
}
