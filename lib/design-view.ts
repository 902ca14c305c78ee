// What a saved design looks like to the screens: one shape shared by the design page's sections.
import type { DesignKind, Requirement } from "@/lib/design";
import type { DesignStatus } from "@/db/schema";
import { can, leadsWithBuildSheet, type PolicyCaller } from "@/lib/auth/policy";

export type RevisionSummary = {
  revision: number;
  authorName: string;
  createdAt: string; // ISO
};

/**
 * A saved design as the screens see it. `kind` tells the two apart: a pair has `choice` and a
 * pair's `metrics` (CandidateDetail); a range plan has `plan` and `metrics.ranges[k]` (each range's
 * figures on its own sub-span with its bench rows), `metrics.switchRule` and `metrics.protection`.
 */
export type DesignView = DesignViewBase & DesignKind;

export type PlanDesignView = Extract<DesignView, { kind: "plan" }>;
export type PairDesignView = Extract<DesignView, { kind: "pair" }>;

type DesignViewBase = {
  id: string;
  name: string;
  project: string | null;
  status: DesignStatus;
  revision: number;
  requirement: Requirement; // normalized, SI
  authorId: string; // author of the current revision
  authorName: string;
  updatedAt: string; // ISO
  approval: { byName: string; at: string; revision: number } | null; // the approval of the current revision, if any
  revisions: RevisionSummary[];
};

/**
 * A design as the design page's client sections get it: without its list of revisions, which none
 * of them reads (the history gets its own rows), so fifty revisions do not ride along in the page.
 */
export type ClientDesignView = DesignView extends infer D
  ? D extends DesignView
    ? Omit<D, "revisions">
    : never
  : never;

export function clientDesignView(design: DesignView): ClientDesignView {
  const { revisions: _kept, ...rest } = design;
  return rest;
}

/** What the viewer may do with one design: booleans from the policy, computed on the server. */
export type DesignViewer = {
  userId: string;
  may: {
    edit: boolean;
    /** The role gives verdicts at all … */
    judge: boolean;
    /** … and on this design's current revision (not its author). */
    judgeThis: boolean;
    uploadProfiles: boolean;
    /** Record built units at all … */
    recordUnits: boolean;
    /** … and edit or delete units someone else recorded (else only one's own). */
    changeOthersUnits: boolean;
  };
  /** A maker comes to build: the build sheet leads the page. */
  leadsWithBuildSheet: boolean;
};

export function designViewerFor(caller: PolicyCaller, design: { authorId: string }): DesignViewer {
  return {
    userId: caller.userId,
    may: {
      edit: can(caller, "design.edit"),
      judge: can(caller, "design.judge"),
      judgeThis: can(caller, "design.judge", { authorId: design.authorId }),
      uploadProfiles: can(caller, "profile.upload"),
      recordUnits: can(caller, "unit.record"),
      changeOthersUnits: can(caller, "unit.change", { recordedBy: "" }),
    },
    leadsWithBuildSheet: leadsWithBuildSheet(caller),
  };
}
