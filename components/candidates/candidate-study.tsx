"use client";
// The wizard's candidate study: the engine works the pair's figures out in the browser as the
// pair or the pinned ones change (a saved design's page gets them from the server instead).
import { useMemo } from "react";
import { candidateStudy } from "@/lib/design/candidate-study";
import type { Requirement } from "@/lib/design/requirement";
import type { CandidateDetail, Choice } from "@/lib/design/types";
import { CandidateStudyView } from "./candidate-study-view";

export function CandidateStudy({
  req,
  choice,
  pinned = [],
  title,
  saved,
}: {
  req: Requirement;
  choice: Choice;
  pinned?: Choice[];
  title?: string;
  /** Figures stored with a saved revision; shown instead of a fresh evaluation. */
  saved?: CandidateDetail;
}) {
  const figures = useMemo(() => candidateStudy(req, choice, { pinned, saved }), [req, choice, pinned, saved]);
  return <CandidateStudyView req={req} choice={choice} figures={figures} title={title} />;
}
