// The default ranking in words, apart from ./solve so a screen that shows it does not load the
// sweep and the expression parser behind a custom ranking. ./solve re-exports it.
export const defaultRankingText =
  "Sum of each objective as a share of its limit: errorAtMinPercent / accuracy target + burdenV / allowed drop + lsbA / (Imin / counts at Imin); lower first.";
