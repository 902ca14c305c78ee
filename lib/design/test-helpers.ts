// Test-only helper: parse a requirement or fail loudly.
import { parseRequirement, type Requirement, type RequirementInput } from "./requirement";

export function req(input: RequirementInput): Requirement {
  const r = parseRequirement(input);
  if (!r.ok) throw new Error(r.message);
  return r.requirement;
}
