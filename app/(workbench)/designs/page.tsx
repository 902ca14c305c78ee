import type { Metadata } from "next";
import { EmptyState } from "@/components/ui/panel";
import { requirePageCaller } from "@/lib/auth/gate";

export const metadata: Metadata = { title: "Designs" };

export default async function DesignsPage() {
  await requirePageCaller("/designs");
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-lg font-semibold">Designs</h1>
      <EmptyState title="No designs yet">
        The team&apos;s saved shunt-and-amplifier designs will be listed here, with their review status and revision.
      </EmptyState>
    </div>
  );
}
