import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Wizard } from "@/components/wizard/wizard";
import { getDesignView } from "@/db/queries/designs";
import { isUuid } from "@/lib/ids";
import { requirePageCaller } from "@/lib/auth/gate";
import { can } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Revise design" };

/** The wizard on a saved design's requirement and pair; saving makes its next revision. */
export default async function ReviseDesignPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const caller = await requirePageCaller(`/designs/${id}/revise`);
  if (!isUuid(id)) notFound();
  const design = await getDesignView(id, caller.teamId);
  // The policy says who may see the design and who may save its next revision.
  if (!design || !can(caller, "design.read", design)) notFound();
  const canSave = can(caller, "design.edit");
  return (
    <div className="flex flex-col gap-4">
      <div>
        <p className="text-xs text-ink-muted">
          <Link href="/designs" className="hover:text-ink">
            Designs
          </Link>{" "}
          /{" "}
          <Link href={`/designs/${design.id}`} className="hover:text-ink">
            {design.name}
          </Link>
        </p>
        <h1 className="text-lg font-semibold break-words">
          Revise <span data-testid="design-name">{design.name}</span>
        </h1>
        <p className="max-w-3xl text-ink-muted">
          The wizard starts from revision {design.revision}&apos;s requirement with its saved{" "}
          {design.kind === "plan" ? "range plan in the plan editor" : "pair picked"}. Change what the review asked for;
          saving makes revision {design.revision + 1} as a draft, to submit again. If someone else saves first, nothing
          of yours is written and the page says so.
        </p>
      </div>
      <Wizard
        canSave={canSave}
        revise={{
          id: design.id,
          revision: design.revision,
          name: design.name,
          project: design.project,
          requirement: design.requirement,
          choice: design.kind === "pair" ? design.choice : null,
          plan: design.kind === "plan" ? design.plan : null,
        }}
      />
    </div>
  );
}
