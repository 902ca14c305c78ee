import type { Metadata } from "next";
import Link from "next/link";
import { ImportDesign } from "@/components/designs-list/design-import";
import { DesignsTable } from "@/components/designs-list/designs-table";
import { readListParams } from "@/components/designs-list/list-params";
import { buttonClass } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/panel";
import { requirePageCaller } from "@/lib/auth/gate";
import { decodeListCursor } from "@/lib/saved-designs/list-cursor";
import { designsListPage } from "@/lib/saved-designs/list-page";
import { can } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Designs" };

const PAGE_SIZE = 50;

export default async function DesignsPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const caller = await requirePageCaller("/designs");
  const approvedOnly = !can(caller, "design.read-unapproved");
  const params = readListParams(await searchParams);
  // The page the URL names, rendered here so the first paint has rows; the table takes over in the
  // browser through GET /api/designs. A cursor this team's list did not give out starts at page 1.
  const after = params.cursor ? decodeListCursor(caller.teamId, params.cursor) : undefined;
  if (after === null) params.cursor = "";
  const initial = await designsListPage(caller, {
    status: params.status || undefined,
    q: params.q || undefined,
    limit: PAGE_SIZE,
    after: after ?? undefined,
  });
  const teamHasNone = !params.q && !params.status && !params.cursor && initial.designs.length === 0;
  const canCreate = can(caller, "design.create");
  return (
    <div className="flex min-w-0 flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div className="min-w-0">
          <h1 className="text-lg font-semibold">Designs</h1>
          <p className="text-ink-muted">
            {approvedOnly
              ? "The team's approved designs, ready to build."
              : `The shunt-and-amplifier designs of ${caller.teamName}, with their review status and revision.`}
          </p>
        </div>
        {canCreate && (
          <div className="flex items-center gap-2">
            <ImportDesign />
            <Link href="/designs/new" className={buttonClass("primary")}>
              New design
            </Link>
          </div>
        )}
      </div>
      {teamHasNone ? (
        <EmptyState title={approvedOnly ? "No approved designs yet" : "No designs yet"}>
          {canCreate
            ? "Start one with “New design”: state the requirement and pick a shunt and gain from the sweep."
            : "Designs saved by the team's owners and designers appear here."}
        </EmptyState>
      ) : (
        <DesignsTable initial={initial} initialParams={params} />
      )}
    </div>
  );
}
