// The bench check of a saved revision, as GET /api/designs/[id] reports it (API.md "Built units").
import { storedRequirement } from "@/db/queries/designs";
import { benchCheck, type BenchCheckRow, type Choice } from "@/lib/design";

export function savedBenchCheck(requirement: unknown, choice: Choice): BenchCheckRow[] {
  return benchCheck(storedRequirement(requirement), choice);
}
