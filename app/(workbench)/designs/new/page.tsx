import type { Metadata } from "next";
import { Wizard } from "@/components/wizard/wizard";
import { requirePageCaller } from "@/lib/auth/gate";
import { can } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "New design" };

export default async function NewDesignPage() {
  const caller = await requirePageCaller("/designs/new");
  const canSave = can(caller, "design.create");
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-lg font-semibold">New design</h1>
        <p className="max-w-3xl text-ink-muted">
          State what the front end must do, step by step. Every change re-runs the sweep of standard shunt values and
          amplifier gains; pick a candidate from the chart or the table, study it across the whole span, and save it.
        </p>
      </div>
      <Wizard canSave={canSave} />
    </div>
  );
}
