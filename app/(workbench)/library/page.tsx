import type { Metadata } from "next";
import { LibraryWorkbench } from "@/components/library/library-workbench";
import { listLibrary } from "@/db/queries/library";
import { requirePageCaller } from "@/lib/auth/gate";
import { can } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Library" };

export default async function LibraryPage() {
  const caller = await requirePageCaller("/library");
  const library = await listLibrary(caller.teamId);
  const canEdit = can(caller, "library.edit");
  return (
    <div className="flex flex-col gap-2">
      <div>
        <h1 className="text-lg font-semibold">Parts library</h1>
        <p className="max-w-prose text-ink-muted">
          The amplifiers, shunt families and readouts (ADCs, meter ranges) {caller.teamName} builds with. The design
          wizard&apos;s parts and readout steps pick from them; figures are the data-sheet values the error budget uses
          (worst case at 25 °C, drifts per kelvin).
          {canEdit ? "" : " Owners and designers edit the library."}
        </p>
      </div>
      <LibraryWorkbench library={library} canEdit={canEdit} />
    </div>
  );
}
