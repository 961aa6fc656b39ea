import { Badge, type BadgeTone } from "@/components/ui/badge";
import { STAGE_LABELS, type Stage } from "@/lib/release/stages";

const TONE: Record<Stage, BadgeTone> = { draft: "neutral", review: "info", validation: "info", pilot: "accent", production: "ok", withdrawn: "fault" };

export function StageBadge({ stage }: { stage: Stage }) {
  return <Badge tone={TONE[stage]}>{STAGE_LABELS[stage]}</Badge>;
}
