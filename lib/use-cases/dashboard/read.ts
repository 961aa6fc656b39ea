import "server-only";
import type { Executor } from "@/db/client";
import { describeAuditEvents } from "@/db/audit-subjects";
import { countBuildsByStage, recentActivity, reviewsWaitingFor } from "@/db/dashboard";
import { can, type Role } from "@/lib/auth/roles";

/** What the dashboard shows a person: builds per stage, the reviews waiting for them (if they review), and the latest changes in words. */
export async function dashboard(db: Executor, viewer: { userId: string; role: Role }) {
  const [byStage, waiting, activity] = await Promise.all([
    countBuildsByStage(db),
    can(viewer.role, "build:review") ? reviewsWaitingFor(db, { userId: viewer.userId }) : Promise.resolve([]),
    recentActivity(db, { limit: 12 }).then((events) => describeAuditEvents(db, events)),
  ]);
  return { byStage, waiting, activity };
}
