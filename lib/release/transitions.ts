import type { Capability } from "../auth/roles";
import type { Stage } from "./stages";

/** The promotion path; withdrawn is the side exit from review or later. */
export const PROMOTION_PATH = ["draft", "review", "validation", "pilot", "production"] as const satisfies readonly Stage[];

/** Stages a build may be withdrawn from: anything a reviewer has seen. */
export const WITHDRAWABLE: readonly Stage[] = ["review", "validation", "pilot", "production"];

/** The stage after `from` on the promotion path, or null at the end or when withdrawn. */
export function nextStage(from: Stage): Stage | null {
  const i = (PROMOTION_PATH as readonly Stage[]).indexOf(from);
  return i >= 0 && i < PROMOTION_PATH.length - 1 ? PROMOTION_PATH[i + 1]! : null;
}

/** Who may move a build into `to`; checked on the server beside the gate itself. */
export function capabilityFor(to: Stage): Capability {
  if (to === "review") return "build:create";
  if (to === "withdrawn") return "build:withdraw";
  return "build:promote";
}

/** Why `from → to` is not a move the pipeline has, or null when it is one. */
export function transitionShapeError(from: Stage, to: Stage): string | null {
  if (to === "withdrawn") {
    return WITHDRAWABLE.includes(from) ? null : `A build in ${from} cannot be withdrawn; only builds in review or later can.`;
  }
  const next = nextStage(from);
  if (next === to) return null;
  return next ? `A build in ${from} moves to ${next} next, not to ${to}.` : `A build in ${from} has no further stage.`;
}
