// A saved design that fails under today's model (lib/design/saved-verdict.ts): said at the top of
// the design page and over the build sheet, naming the failing constraint, so nobody builds from
// figures the engine no longer stands behind.
import type { SavedVerdict } from "@/lib/design/saved-verdict";

export function SavedVerdictNotice({ verdict }: { verdict: SavedVerdict }) {
  if (!verdict.fails) return null;
  return (
    <div
      role="alert"
      data-testid="saved-verdict"
      className="rounded border border-bad/40 bg-bad/5 px-3 py-2 text-sm text-ink"
    >
      <p className="font-semibold text-bad">Fails under the current model</p>
      <p className="mt-0.5 text-xs">{verdict.statement}</p>
    </div>
  );
}
