// The wizard's draft in localStorage, so a reload (or a closed tab) loses nothing.
import type { PlanChoice } from "@/lib/design/plan-choice";
import type { WizardValues } from "./form-values";

export type ReadoutPart = { id: string; name: string };

export type Draft = {
  version: 1;
  values: Partial<WizardValues>;
  step: number;
  /** The furthest step open to the tabs (an example or a saved design opens them all). */
  visited?: number;
  dropMode: "volts" | "share";
  gainMode: "list" | "pair";
  partName: string | null;
  /** The team library's ADC or meter range the readout step was filled from (row id and name). */
  readoutPart?: ReadoutPart | null;
  selected: string | null;
  /** The designer picked `selected` themselves; otherwise the selection follows the ranking. */
  chosen?: boolean;
  pinned: string[];
  /** The range plan on screen and whether the designer adjusted it (else it follows the engine's proposal). */
  plan?: PlanChoice | null;
  planEdited?: boolean;
  name: string;
  project: string;
};

const NEW_KEY = "sensewright.wizard.draft";
/** New designs share one draft; a revision in progress has its own, per design and revision. */
export const draftKey = (revising?: { id: string; revision: number }) =>
  revising ? `sensewright.wizard.revise.${revising.id}.${revising.revision}` : NEW_KEY;

export function loadDraft(key = NEW_KEY): Draft | null {
  try {
    const raw = window.localStorage.getItem(key);
    if (!raw) return null;
    const d = JSON.parse(raw) as Draft;
    return d && d.version === 1 && typeof d.values === "object" ? d : null;
  } catch {
    return null;
  }
}

export function saveDraft(d: Draft, key = NEW_KEY) {
  try {
    window.localStorage.setItem(key, JSON.stringify(d));
  } catch {
    /* storage full or disabled: the form still works, only the reload safety is lost */
  }
}

export function clearDraft(key = NEW_KEY) {
  try {
    window.localStorage.removeItem(key);
  } catch {
    /* nothing to clear */
  }
}
