import type { Metadata } from "next";
import Link from "next/link";
import { ImportDesign } from "@/components/designs-list/design-import";
import { DesignsTable } from "@/components/designs-list/designs-table";
import { buttonClass } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/panel";
import { listDesigns } from "@/db/queries/designs";
import { requirePageCaller } from "@/lib/auth/gate";
import { can } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Designs" };

export default async function DesignsPage() {
  const caller = await requirePageCaller("/designs");
  const approvedOnly = !can(caller, "design.read-unapproved");
  const designs = await listDesigns(caller.teamId, { approvedOnly });
  const canCreate = can(caller, "design.create");
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
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
      {designs.length === 0 ? (
        <EmptyState title={approvedOnly ? "No approved designs yet" : "No designs yet"}>
          {canCreate
            ? "Start one with “New design”: state the requirement and pick a shunt and gain from the sweep."
            : "Designs saved by the team's owners and designers appear here."}
        </EmptyState>
      ) : (
        <DesignsTable designs={designs} />
      )}
    </div>
  );
}
