// Why pairs were refused: counts by first failing constraint, in plain words.
import { rejectReasonLabels, rejectReasons, type RejectReason } from "@/lib/design/reject-reasons";

export function Rejections({
  rejected,
  evaluated,
  feasibleCount,
}: {
  rejected: Record<RejectReason, number>;
  evaluated: number;
  feasibleCount: number;
}) {
  const rows = rejectReasons.map((r) => ({ r, n: rejected[r] ?? 0 })).filter((x) => x.n > 0);
  return (
    <div className="flex flex-col gap-1.5 text-xs" data-testid="rejections">
      <p className="text-ink-muted num">
        {evaluated.toLocaleString("en")} pairs examined: {feasibleCount.toLocaleString("en")} meet every constraint,{" "}
        {(evaluated - feasibleCount).toLocaleString("en")} refused. Each refused pair counts once, under the first
        constraint it fails.
      </p>
      <table className="w-full">
        <tbody>
          {rows.map(({ r, n }) => (
            <tr key={r}>
              <td className="w-1/2 py-0.5 pr-2">
                {rejectReasonLabels[r]}
                {r === "commonMode" && (
                  <span className="block text-2xs text-ink-faint">
                    The amplifier&apos;s inputs sit at the shunt&apos;s two ends: near 0 V on the low side, at the
                    supply on the high side. Pick a topology and part whose common-mode range covers that.
                  </span>
                )}
              </td>
              <td className="py-0.5">
                <div className="flex items-center gap-2">
                  <div
                    className="h-2 rounded-sm bg-bad/60"
                    style={{ width: `${Math.max(1, (100 * n) / evaluated)}%` }}
                    aria-hidden
                  />
                  <span className="num">{n.toLocaleString("en")}</span>
                </div>
              </td>
            </tr>
          ))}
          {rows.length === 0 && (
            <tr>
              <td className="py-0.5 text-ink-muted">No pair was refused.</td>
            </tr>
          )}
        </tbody>
      </table>
    </div>
  );
}
