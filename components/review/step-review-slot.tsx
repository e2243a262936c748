/**
 * Where a step's review panel goes (verdicts at a revision, disputes, comments). Rendered by the
 * workspace under each step; filled in by the review workflow.
 */
export interface StepReviewSlotProps {
  proofId: number;
  stepId: number;
  revisionId: number | null;
  viewer: { id: number; role: "author" | "reviewer" | "editor" };
}

export function StepReviewSlot(props: StepReviewSlotProps) {
  void props;
  return null;
}
