import type { Metadata } from "next";
import Link from "next/link";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { getDb } from "@/db/client";
import { dashboard } from "@/lib/use-cases/dashboard/read";
import { PageHeader, Panel } from "@/components/ui/panel";
import { Table, Td, Th, EmptyRow } from "@/components/ui/table";
import { STAGE_ORDER, STAGE_LABELS } from "@/lib/release/stages";
import { formatUtc } from "@/lib/time/format";

export const metadata: Metadata = { title: "Dashboard" };

export default async function DashboardPage() {
  const actor = await requirePageActor("read");
  const { byStage, waiting, activity } = await dashboard(getDb(), actor);
  return (
    <>
      <PageHeader title="Dashboard" subtitle={`Signed in as ${actor.name}`} />
      <div className="grid gap-5 lg:grid-cols-3">
        <Panel title="Builds by stage" className="lg:col-span-3">
          <ol className="grid grid-cols-3 gap-3 md:grid-cols-6" aria-label="Builds by stage">
            {STAGE_ORDER.map((stage) => (
              <li key={stage}>
                <Link
                  href={`/builds?stage=${stage}`}
                  className="block rounded border border-ink-200 px-3 py-2 text-ink-900 no-underline hover:border-copper-300 hover:bg-copper-50"
                  aria-label={`${STAGE_LABELS[stage]}: ${byStage[stage]} build${byStage[stage] === 1 ? "" : "s"}, show them`}
                >
                  <span className="block text-xs uppercase tracking-wide text-ink-600">{STAGE_LABELS[stage]}</span>
                  <span className="block text-2xl font-semibold tabular-nums" data-testid={`stage-count-${stage}`}>
                    {byStage[stage]}
                  </span>
                </Link>
              </li>
            ))}
          </ol>
        </Panel>
        <Panel title="Reviews waiting for you">
          {waiting.length === 0 ? (
            <p className="text-sm text-ink-600">Nothing waits for your review.</p>
          ) : (
            <ul className="space-y-1.5 text-sm">
              {waiting.map((b) => (
                <li key={b.id}>
                  <Link href={`/builds/${b.id}`}>
                    {b.boardModel} {b.version}
                  </Link>
                </li>
              ))}
            </ul>
          )}
        </Panel>
        <Panel title="Recent activity" className="lg:col-span-2">
          <Table caption="Recent activity">
            <thead>
              <tr>
                <Th>When</Th>
                <Th>What happened</Th>
              </tr>
            </thead>
            <tbody>
              {activity.length === 0 && <EmptyRow colSpan={2}>No activity yet.</EmptyRow>}
              {activity.map((a) => (
                <tr key={a.id}>
                  <Td className="whitespace-nowrap tabular-nums text-ink-600">{formatUtc(a.createdAt)}</Td>
                  <Td>
                    {a.subject?.href ? <Link href={a.subject.href}>{a.sentence}</Link> : a.sentence}
                  </Td>
                </tr>
              ))}
            </tbody>
          </Table>
        </Panel>
      </div>
    </>
  );
}
