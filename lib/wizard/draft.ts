// The wizard's draft in localStorage, so a reload (or a closed tab) loses nothing.
import type { WizardValues } from "./form-values";

export type Draft = {
  version: 1;
  values: Partial<WizardValues>;
  step: number;
  dropMode: "volts" | "share";
  gainMode: "list" | "pair";
  partName: string | null;
  selected: string | null;
  pinned: string[];
  name: string;
  project: string;
};

const KEY = "sensewright.wizard.draft";

export function loadDraft(): Draft | null {
  try {
    const raw = window.localStorage.getItem(KEY);
    if (!raw) return null;
    const d = JSON.parse(raw) as Draft;
    return d && d.version === 1 && typeof d.values === "object" ? d : null;
  } catch {
    return null;
  }
}

export function saveDraft(d: Draft) {
  try {
    window.localStorage.setItem(KEY, JSON.stringify(d));
  } catch {
    /* storage full or disabled: the form still works, only the reload safety is lost */
  }
}

export function clearDraft() {
  try {
    window.localStorage.removeItem(KEY);
  } catch {
    /* nothing to clear */
  }
}
