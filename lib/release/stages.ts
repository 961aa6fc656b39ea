/** Release stages of a build, in promotion order; withdrawn is the side exit. */
export const STAGE_ORDER = ["draft", "review", "validation", "pilot", "production", "withdrawn"] as const;
export type Stage = (typeof STAGE_ORDER)[number];

export const STAGE_LABELS: Record<Stage, string> = {
  draft: "Draft",
  review: "In review",
  validation: "Lab validation",
  pilot: "Pilot run",
  production: "Factory release",
  withdrawn: "Withdrawn",
};
