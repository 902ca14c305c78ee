import type { Metadata } from "next";
import { EmptyState } from "@/components/ui/panel";
import { requirePageCaller } from "@/lib/auth/gate";

export const metadata: Metadata = { title: "Library" };

export default async function LibraryPage() {
  await requirePageCaller("/library");
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-lg font-semibold">Parts library</h1>
      <EmptyState title="The parts library is empty">
        The team&apos;s amplifiers and shunts will be kept here, for the design wizard to pick from.
      </EmptyState>
    </div>
  );
}
