import type { Metadata } from "next";
import { MeterCheck } from "@/components/meter/meter-check";
import { requirePageCaller } from "@/lib/auth/gate";

export const metadata: Metadata = { title: "Meter check" };

export default async function MeterPage() {
  await requirePageCaller("/meter");
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
    </div>
  );
}
