"use client";

import { useQueries, useQuery } from "@tanstack/react-query";
import dynamic from "next/dynamic";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useMemo } from "react";
import { apiQuery } from "@/lib/api/client";
import { getProfile, getVersion } from "@/lib/api/endpoints";
import type { CoolingProfile } from "@/lib/engine";
// From its own module, not the engine's index: the index would bring the validators and the encoder into the page.
import { evaluateCurves } from "@/lib/evaluation/curve-table";
import { toHardwareContext } from "@/lib/registry/hardware-context";
import { coolingBranchRpm } from "@/lib/registry/cooling-branch";
import { documentText } from "@/lib/registry/starter-profile";
import { Select } from "@/components/ui/field";
import { EstimateCaution, Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import type { CompareRow } from "./charts/compare-chart";
import { ErrorNotice } from "@/components/ui/error-notice";

const DiffView = dynamic(() => import("./editor/diff-view"), { ssr: false, loading: () => <div className="h-[480px] animate-pulse rounded bg-ink-100" /> });
const CompareChart = dynamic(() => import("./charts/compare-chart"), { ssr: false, loading: () => <div className="h-80 animate-pulse rounded bg-ink-100" /> });

export function CompareView({ id }: { id: string }) {
  const sp = useSearchParams();
  const router = useRouter();
  const pathname = usePathname();
  const detail = useQuery(apiQuery(getProfile, { params: { id } }));
  const versions = detail.data?.versions ?? [];
  const a = sp.get("a") ?? versions[1]?.id ?? "";
  const b = sp.get("b") ?? versions[0]?.id ?? "";
  const docs = useQueries({
    queries: [a, b].map((vid) => ({
      ...apiQuery(getVersion, { params: { id: vid } }),
      enabled: Boolean(vid),
    })),
  });
  const [va, vb] = [docs[0]?.data?.version, docs[1]?.data?.version];

  const rows = useMemo<CompareRow[]>(() => {
    const d = detail.data;
    const rev = d?.revisions[d.revisions.length - 1];
    if (!d || !rev || !va || !vb) return [];
    const hw = toHardwareContext({ cooler: d.cooler, fan: d.fan, pump: d.pump, revision: rev });
    const opts = { fromC: 20, toC: 70, stepC: 0.5 };
    try {
      const docB = vb.document as CoolingProfile;
      const ra = evaluateCurves(va.document as CoolingProfile, hw, opts);
      const rb = evaluateCurves(docB, hw, opts);
      return ra.map((r, i) => {
        const pumpB = Math.round(rb[i]?.pumpRpm ?? 0);
        const fanB = Math.round(rb[i]?.fanRpm ?? 0);
        return {
          tempC: r.tempC,
          pumpA: Math.round(r.pumpRpm),
          fanA: Math.round(r.fanRpm),
          pumpB,
          fanB,
          pumpBandB: [Math.round(coolingBranchRpm(docB, hw, "pump", r.tempC)), pumpB] as [number, number],
          fanBandB: [Math.round(coolingBranchRpm(docB, hw, "fans", r.tempC)), fanB] as [number, number],
        };
      });
    } catch {
      return [];
    }
  }, [detail.data, va, vb]);

  if (detail.isPending) return <div className="h-96 animate-pulse rounded-md bg-white shadow-panel" />;
  if (detail.isError)
    return (
      <ErrorNotice error={detail.error} onRetry={() => void detail.refetch()} />
    );
  if (versions.length < 2) return <Notice title="Nothing to compare">This profile has fewer than two published versions.</Notice>;

  const pick = (key: "a" | "b", value: string) => {
    const p = new URLSearchParams(sp.toString());
    p.set("a", a);
    p.set("b", b);
    p.set(key, value);
    router.replace(`${pathname}?${p.toString()}`);
  };

  return (
    <div className="space-y-5">
      <EstimateCaution />
      <div className="flex flex-wrap gap-4 rounded-md bg-white p-4 shadow-panel">
        {(["a", "b"] as const).map((key) => (
          <label key={key} className="text-sm">
            <span className="mb-1 block font-medium text-ink-800">{key === "a" ? "Left (older)" : "Right (newer)"}</span>
            <Select value={key === "a" ? a : b} onChange={(e) => pick(key, e.target.value)} className="w-48">
              {versions.map((v) => <option key={v.id} value={v.id}>{v.version}</option>)}
            </Select>
          </label>
        ))}
      </div>
      {docs.some((d) => d.isError) && (
        <ErrorNotice error={docs.find((d) => d.isError)?.error} onRetry={() => docs.forEach((d) => void d.refetch())} />
      )}
      {va && vb && (
        <>
          <Panel title={`Curves: ${va.version} (dashed) and ${vb.version} (solid)`}>
            <CompareChart rows={rows} labelA={va.version} labelB={vb.version} criticalA={(va.document as CoolingProfile).criticalTempC} criticalB={(vb.document as CoolingProfile).criticalTempC} />
          </Panel>
          <Panel title={`Text: ${va.version} → ${vb.version}`}>
            <DiffView original={documentText(va.document)} modified={documentText(vb.document)} />
          </Panel>
        </>
      )}
    </div>
  );
}
