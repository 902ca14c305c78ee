// A battery capacity typed beside a profile summary. The screen loads this module when the field is
// first used: it carries the engine's unit parser.
import { parseQuantity } from "@/lib/design/units";

/**
 * A battery capacity typed by the user ("220 mAh", "2.4 Ah", "800 C") in coulombs, or null. The
 * engine's quantity parser reads it (mathjs knows A·h); a bare number is taken in mAh, the unit
 * batteries are labelled in.
 */
export function parseCapacityC(text: string): number | null {
  const bare = /^\s*[+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?\s*$/i.test(text);
  const r = parseQuantity(bare ? `${text.trim()} mAh` : text, "charge");
  return r.ok && Number.isFinite(r.value) && r.value > 0 ? r.value : null;
}

export { formatDuration } from "./duration";
