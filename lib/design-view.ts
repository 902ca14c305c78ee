// What a saved design looks like to the screens: one shape shared by the design page's sections.
import type { CandidateDetail, Choice, Requirement } from "@/lib/design";
import type { DesignStatus, Role } from "@/db/schema";

export type RevisionSummary = {
  revision: number;
  authorName: string;
  createdAt: string; // ISO
};

export type DesignView = {
  id: string;
  name: string;
  project: string | null;
  status: DesignStatus;
  revision: number;
  requirement: Requirement; // normalized, SI
  choice: Choice;
  metrics: CandidateDetail; // the engine's figures at the time of the revision
  authorId: string; // author of the current revision
  authorName: string;
  updatedAt: string; // ISO
  approval: { byName: string; at: string; revision: number } | null; // the approval of the current revision, if any
  revisions: RevisionSummary[];
};

/** What the viewer may do on the design page. */
export type DesignViewer = { userId: string; role: Role };
