// Who may do what with built units. Kept beside the routes until it moves into the one
// authorization policy (lib/auth/policy.ts): record — owners, designers and makers; edit and
// delete — owners and designers any unit, makers only the units they recorded; reviewers read.
import type { Role } from "@/db/schema";
import type { Caller } from "@/lib/auth/gate";
import { HttpError } from "@/lib/http";

export const unitRecorderRoles: readonly Role[] = ["owner", "designer", "maker"];

export type UnitAction = "record" | "edit" | "delete";

const verbs: Record<UnitAction, string> = { record: "record", edit: "edit", delete: "delete" };

/** null when allowed, else the reason (for a 403). */
export function builtUnitPolicy(
  caller: Pick<Caller, "userId" | "role">,
  action: UnitAction,
  unit?: { recordedBy: string; recordedByName: string; serial: string },
): string | null {
  if (!unitRecorderRoles.includes(caller.role))
    return `Only owners, designers and makers may ${verbs[action]} built units; you are signed in as a ${caller.role}.`;
  if (action === "record" || !unit) return null;
  if (caller.role === "owner" || caller.role === "designer") return null;
  if (unit.recordedBy === caller.userId) return null;
  return `Unit ${unit.serial} was recorded by ${unit.recordedByName}: a maker may ${verbs[action]} only the units they recorded (owners and designers may ${verbs[action]} any).`;
}

export function assertUnitAllowed(...args: Parameters<typeof builtUnitPolicy>): void {
  const why = builtUnitPolicy(...args);
  if (why) throw new HttpError(403, why);
}
