import { Badge, type BadgeTone } from "@/components/ui/badge";
import { STAGE_LABELS, type Stage } from "@/lib/release/stages";

/** Early stages read as in progress, the factory stage as done, a withdrawal as a fault. */
const TONES: Record<Stage, BadgeTone> = { draft: "neutral", review: "info", validation: "info", pilot: "accent", production: "ok", withdrawn: "fault" };

/** The one badge for a build's release stage, on every screen that names a stage. */
export function StageBadge({ stage }: { stage: Stage }) {
  return <Badge tone={TONES[stage]}>{STAGE_LABELS[stage]}</Badge>;
}
