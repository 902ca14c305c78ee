// An accuracy target as the form shows it, apart from ./ambiguous-percent (which parses whole
// requirements) so the wizard's form code loads no schema to write one.

/** Below this a bare accuracy target reads like a fraction (0.02 for 2 %). Common practice, no source. */
export const AMBIGUOUS_PERCENT_BELOW = 0.1;

/** An accuracy target (%) as form text that reads back to it: with its sign where a bare number is refused. */
export function accuracyTargetText(percent: number): string {
  return percent > 0 && percent < AMBIGUOUS_PERCENT_BELOW ? `${percent} %` : String(percent);
}
