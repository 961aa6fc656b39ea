/** Release stages of a build, in promotion order; withdrawn is the side exit. */
export const STAGE_ORDER = ["draft", "review", "validation", "pilot", "production", "withdrawn"] as const;
export type Stage = (typeof STAGE_ORDER)[number];

/** Stages during which lab evidence may still be attached or replaced: before the pilot run flashes boards. */
export const EVIDENCE_STAGES = ["draft", "review", "validation"] as const satisfies readonly Stage[];

/** Stages whose builds the factory may flash, so a production lot may name them. */
export const LOT_STAGES = ["pilot", "production"] as const satisfies readonly Stage[];

/** Whether a build in `stage` still takes lab evidence. */
export function takesEvidence(stage: Stage): boolean {
  return (EVIDENCE_STAGES as readonly Stage[]).includes(stage);
}

/** Whether a production lot may name a build in `stage`. */
export function lotMayName(stage: Stage): boolean {
  return (LOT_STAGES as readonly Stage[]).includes(stage);
}

export const STAGE_LABELS: Record<Stage, string> = {
  draft: "Draft",
  review: "In review",
  validation: "Lab validation",
  pilot: "Pilot run",
  production: "Factory release",
  withdrawn: "Withdrawn",
};
