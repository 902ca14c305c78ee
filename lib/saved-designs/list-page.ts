// One page of the designs list as the API answers it and the list page first paints it.
import { pageDesigns, type DesignListKey } from "@/db/queries/designs";
import type { DesignStatus } from "@/db/schema";
import type { Caller } from "@/lib/auth/gate";
import { can } from "@/lib/auth/policy";
import { encodeListCursor } from "./list-cursor";
import { withCurrentModelVerdicts } from "./list-verdicts";

/** Newest change first, after `after`; makers see approved designs only; each row flagged when it fails today's model. */
export async function designsListPage(
  caller: Caller,
  query: { limit: number; status?: DesignStatus; q?: string; after?: DesignListKey },
) {
  const page = await pageDesigns(caller.teamId, { ...query, approvedOnly: !can(caller, "design.read-unapproved") });
  return {
    designs: await withCurrentModelVerdicts(page.designs),
    nextCursor: page.next ? encodeListCursor(caller.teamId, page.next) : null,
  };
}
