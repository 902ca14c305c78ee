// The wizard's own performance measures, which scripts/bench/wizard.ts reads from the page.

/** Record `name` from `start` (performance.now()) to now; a browser without User Timing level 3 records nothing. */
export function measureSince(name: "wizard-roundtrip" | "wizard-resolve" | "wizard-settled", start: number) {
  try {
    performance.measure(name, { start, end: performance.now() });
  } catch {
    /* nothing to record */
  }
}
