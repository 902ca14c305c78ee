import type { Metadata } from "next";
import { MeterCheck } from "@/components/meter/meter-check";
import { PlanBesideMeter, type PlanForMeter } from "@/components/meter/plan-beside-meter";
import { getDesignView, isUuid } from "@/db/queries/designs";
import { listPlanDesigns } from "@/db/queries/plan-designs";
import { requirePageCaller } from "@/lib/auth/gate";
import { can } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Meter check" };

export default async function MeterPage({ searchParams }: { searchParams: Promise<{ design?: string | string[] }> }) {
  const caller = await requirePageCaller("/meter");
  const plans = await listPlanDesigns(caller.teamId, { approvedOnly: !can(caller, "design.read-unapproved") });
  const asked = (await searchParams).design;
  const id = typeof asked === "string" && isUuid(asked) ? asked : plans[0]?.id;
  // Only a plan design the caller may read; anything else leaves the picker on its prompt.
  const view = id ? await getDesignView(id, caller.teamId) : null;
  const selected: PlanForMeter | null =
    view && view.kind === "plan" && can(caller, "design.read", view)
      ? { id: view.id, name: view.name, revision: view.revision, requirement: view.requirement, plan: view.plan }
      : null;
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-lg font-semibold">Meter check</h1>
        <p className="max-w-3xl text-ink-muted">
          What does putting a meter&apos;s current range in series do to the circuit? Its range resistance takes a
          burden voltage from the load, and a load that is not constant-current draws a different current because of it.
        </p>
      </div>
      <MeterCheck />
      <PlanBesideMeter plans={plans.map(({ id, name }) => ({ id, name }))} selected={selected} />
    </div>
  );
}
