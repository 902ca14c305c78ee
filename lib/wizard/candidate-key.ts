import type { Choice } from "@/lib/design/types";

/** A stable key for a (shunt, gain) pair. */
export const candidateKey = (c: Choice) => `${c.shuntOhms}|${c.gain}`;

export function choiceFromKey(key: string): Choice | null {
  const [r, g] = key.split("|").map(Number);
  return r !== undefined && g !== undefined && r > 0 && g > 0 ? { shuntOhms: r, gain: g } : null;
}
