// The engine's verdict on an adjusted plan (evaluatePlan, the same check the server makes on
// save), in the shape the wizard shows beside Save.
import type { PlanChoice } from "@/lib/design/plan-choice";
import { evaluatePlan } from "@/lib/design/plan-evaluation";
import type { Requirement } from "@/lib/design/requirement";
import type { PlanVerdict } from "./plan-protocol";

export function planVerdict(req: Requirement, plan: PlanChoice): PlanVerdict {
  const e = evaluatePlan(req, plan);
  return e.ok
    ? { sound: true, switchRule: e.switchRule, protection: e.protection }
    : { sound: false, path: e.path, message: e.message };
}
