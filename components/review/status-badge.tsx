import { Badge } from "@/components/ui/badge";
import type { DesignStatus } from "@/db/schema";

const tone = { draft: "neutral", "in-review": "signal", approved: "good", returned: "warn" } as const;

/** A design's status under its API name (draft, in-review, approved, returned). */
export function StatusBadge({ status }: { status: DesignStatus }) {
  return (
    <Badge tone={tone[status]}>
      <span data-testid="design-status">{status}</span>
    </Badge>
  );
}

export const statusExplained: Record<DesignStatus, string> = {
  draft: "Being worked on; submit it when it is ready for review.",
  "in-review": "Waiting for a reviewer's verdict.",
  approved: "Signed off on this revision; makers may build it.",
  returned: "Sent back with a reason; revise it or answer the comments, then submit again.",
};
