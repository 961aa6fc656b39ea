"use client";

import { useQuery } from "@tanstack/react-query";
import dynamic from "next/dynamic";
import Link from "next/link";
import { memo, useCallback, useDeferredValue, useEffect, useMemo, useRef, useState } from "react";
import { apiQuery } from "@/lib/api/client";
import { getProfile } from "@/lib/api/endpoints";
import type { ProfileDetailView, VersionView } from "@/lib/api/operations/profile-schemas";
// Engine modules directly, not the engine's API (lib/engine): the bundler keeps every module the
// API re-exports that it cannot prove free of side effects (semver's among them) in the first load.
import { operatingPoint } from "@/lib/thermal/operating-point";
import { toHardwareContext } from "@/lib/registry/hardware-context";
import { evaluateEditorText } from "@/lib/registry/editor-evaluation";
import { startingBoardRange, type RangeAdmission } from "@/lib/registry/range-fit";
import { Select } from "@/components/ui/field";
import { CoolerPicker, useCoolerChoices, type CoolerChoice } from "./hardware-picker";
import { EstimateCaution, Notice } from "@/components/ui/notice";
import { ErrorNotice } from "@/components/ui/error-notice";
import { Panel } from "@/components/ui/panel";
import type { EditorHandle } from "./json-editor";
import { ImportButton } from "./import-button";
import { MemoryGauge } from "./memory-gauge";
import { OperatingPanel, parseOperatingInputs, type OperatingInputs } from "./operating-panel";
import PointsTable from "./points-table";
import { useCurveEditing } from "./use-curve-editing";
import LiveCurvePlot, { type OperatingMark } from "../charts/live-curve-plot";
import { ProblemsList } from "./problems-list";
import { useAutosave, type SaveState } from "./use-autosave";
import { useLastPlotted } from "./use-last-plotted";
import { DraftConflict } from "./draft-conflict";
import { VersionHistory } from "./version-history";

// Monaco is heavy: it loads on this route only, in the browser only. The live plot is our own
// small SVG (no chart library on the keystroke path), so it ships with the page.
const JsonEditor = dynamic(() => import("./json-editor"), { ssr: false, loading: () => <div className="h-full animate-pulse rounded bg-ink-100" aria-label="Loading the editor" /> });
// The publish form (react-hook-form, the version suggestion with semver) is its own chunk, loaded only for people who may publish.
const PublishPanel = dynamic(() => import("./publish-panel").then((m) => m.PublishPanel));

// Panels outside the keystroke path re-render only when their (deferred) inputs change.
const MemoOperatingPanel = memo(OperatingPanel);
const MemoMemoryGauge = memo(MemoryGauge);
const MemoPublishPanel = memo(PublishPanel);
const MemoProblemsList = memo(ProblemsList);

declare global {
  interface Window {
    /** The editor handle, for the browser benchmark and tests. */
    __loopkeeperEditor?: EditorHandle;
  }
}

const NO_ISSUES: never[] = [];
const NO_RANGES: RangeAdmission[] = [];
// The same element every render: React skips it when the workspace re-renders for a keystroke.
const CAUTION = <EstimateCaution />;

/**
 * `knownRanges`: what the ranges the memory gauge opens with admit, judged on the server, so the
 * first screen needs no range matching (semver's loads when someone types another range).
 */
export function ProfileWorkspace({ id, canWrite, knownRanges = NO_RANGES }: { id: string; canWrite: boolean; knownRanges?: RangeAdmission[] }) {
  const q = useQuery(apiQuery(getProfile, { params: { id } }));
  if (q.isPending) return <div className="h-96 animate-pulse rounded-md bg-white shadow-panel" aria-label="Loading the profile" />;
  if (q.isError)
    return (
      <ErrorNotice error={q.error} onRetry={() => void q.refetch()} />
    );
  return <CoolerChoicesLoader detail={q.data} canWrite={canWrite} knownRanges={knownRanges} />;
}

/**
 * The cooler lists (two queries) are read here, above the component that holds the text, so a
 * keystroke does not run their hooks (key hashing, and an options update after every render).
 */
function CoolerChoicesLoader({ detail, canWrite, knownRanges }: { detail: ProfileDetailView; canWrite: boolean; knownRanges: RangeAdmission[] }) {
  const { choices, loadError } = useCoolerChoices(detail);
  return <Workspace detail={detail} choices={choices} loadError={loadError} canWrite={canWrite} knownRanges={knownRanges} />;
}

function Workspace({
  detail,
  choices,
  loadError,
  canWrite,
  knownRanges,
}: {
  detail: ProfileDetailView;
  choices: CoolerChoice[];
  loadError: boolean;
  canWrite: boolean;
  knownRanges: RangeAdmission[];
}) {
  const { profile, cooler, revisions, versions } = detail;
  const [text, setText] = useState<string>(() => profile.draftText ?? "{}\n");
  const [revisionId, setRevisionId] = useState(revisions[revisions.length - 1]?.id ?? "");
  const [coolerId, setCoolerId] = useState(cooler.id);
  const editor = useRef<EditorHandle | null>(null);
  const chosen = choices.find((c) => c.id === coolerId) ?? choices[0]!;
  const { fan, pump } = chosen;
  const revision = revisions.find((r) => r.id === revisionId) ?? revisions[revisions.length - 1];
  const hw = useMemo(() => (revision ? toHardwareContext({ cooler: chosen.cooler, fan, pump, revision }) : null), [chosen.cooler, fan, pump, revision]);
  // Keystroke path: validation (markers, problems) and the curve table (plots) only.
  const evaluation = useMemo(() => (hw ? evaluateEditorText(text, hw) : null), [text, hw]);
  // Everything else (points table, operating point and load sweep, memory, version suggestion)
  // renders in a background pass React may interrupt, so typing stays within a frame. The publish
  // form reads the editor's text when it is sent: what is sent is what is on screen (the server
  // checks it again).
  const { plotted, beforeEdit } = useLastPlotted(evaluation, hw, profile.lastPlottableDraftText);
  const deferredEvaluation = useDeferredValue(evaluation);
  const deferredHw = useDeferredValue(hw);
  const { state: save, adopt, keepMine } = useAutosave(profile.id, text, canWrite, profile.draftRevision);
  const replaceText = useCallback(
    (t: string) => {
      if (editor.current) return editor.current.setText(t);
      beforeEdit();
      setText(t);
    },
    [beforeEdit],
  );
  const onImported = useCallback(
    (t: string, draftRevision: number) => {
      adopt(t, draftRevision);
      replaceText(t);
    },
    [adopt, replaceText],
  );
  // The publish form reads the text when it is sent (what is on screen), so it need not re-render per keystroke.
  const latestText = useRef(text);
  useEffect(() => {
    latestText.current = text;
  }, [text]);
  const getText = useCallback(() => editor.current?.getText() ?? latestText.current, []);
  const editing = useCurveEditing(editor, evaluation?.profile, hw, canWrite);
  const [operatingInputs, setOperatingInputs] = useState<OperatingInputs>({ heatLoadW: "200", ambientC: "25", distanceM: "1" });
  // The operating point follows every drag step (one bisection, well under a millisecond); it is
  // computed here once per edit, and the operating panel shows the same result in the background pass.
  const operating = useMemo(() => {
    const profileNow = evaluation?.profile;
    const { load, ambient, distance, loadError, ambientError, distanceError } = parseOperatingInputs(operatingInputs, hw);
    if (!profileNow || !hw || loadError || ambientError) return null;
    try {
      const point = operatingPoint(profileNow, hw, { heatLoadW: load, ambientC: ambient, ...(distanceError ? {} : { distanceM: distance }) });
      const atListener = distanceError || point.noise.distanceM === 1 ? null : { distanceM: point.noise.distanceM, soundDbA: point.noise.totalDbAAtDistance };
      return { point, liquidTempC: point.liquidTempC, fanRpm: point.fans.rpm, soundDbA: point.noise.totalDbA1m, atListener, heatLoadW: load, ambientC: ambient };
    } catch {
      return null;
    }
  }, [evaluation?.profile, hw, operatingInputs]);
  const operatingMark = useMemo<OperatingMark | null>(() => (operating ? { liquidTempC: operating.liquidTempC, fanRpm: operating.fanRpm } : null), [operating]);
  const deferredPoint = useDeferredValue(operating?.point ?? null);

  const latest = versions[0];
  // The range typed in the publish form, live: the memory gauge judges it as publishing will.
  const defaultRange = startingBoardRange(latest?.boardRange);
  const [publishRange, setPublishRange] = useState(defaultRange);
  const current = deferredEvaluation?.profile;

  useEffect(() => {
    // Keystroke → markers and plots committed: measured by `npm run bench:editor`.
    if (performance.getEntriesByName("lk-edit", "mark").length > 0) {
      performance.measure("lk-edit-to-update", "lk-edit");
      performance.clearMarks("lk-edit");
    }
    // A drag or key step on the plot → text, markers and plots committed.
    if (performance.getEntriesByName("lk-drag", "mark").length > 0) {
      performance.measure("lk-drag-to-update", "lk-drag");
      performance.clearMarks("lk-drag");
    }
  }, [evaluation]);

  const onEdit = useCallback(
    (t: string) => {
      performance.mark("lk-edit");
      beforeEdit();
      setText(t);
    },
    [beforeEdit],
  );
  const onReady = useCallback((h: EditorHandle) => {
    editor.current = h;
    window.__loopkeeperEditor = h;
  }, []);
  const onJump = useCallback((line: number, column: number) => editor.current?.reveal(line, column), []);
  const limits = useMemo(() => ({ fanMinRpm: fan.rpmAtMinDuty, fanMaxRpm: fan.maxRpm, pumpMinRpm: pump.rpmAtMinDuty, pumpMaxRpm: pump.maxRpm }), [fan, pump]);
  // One empty list for every clean text: the editor's markers and the problems list are left alone while the document stays clean.
  const issues = evaluation && evaluation.issues.length > 0 ? evaluation.issues : NO_ISSUES;

  const errors = deferredEvaluation?.issues.filter((i) => i.severity === "error").length ?? 0;

  return (
    <div className="space-y-5">
      {CAUTION}
      <MemoWorkspaceHeader
        detail={detail}
        choices={choices}
        chosenId={chosen.id}
        onCooler={setCoolerId}
        loadError={loadError}
        revisionId={revision?.id ?? ""}
        onRevision={setRevisionId}
        canWrite={canWrite}
        save={save}
        onImported={onImported}
      />
      {save.kind === "conflict" && (
        <DraftConflict
          conflict={save}
          mine={text}
          onTakeTheirs={(theirs, draftRevision) => {
            adopt(theirs, draftRevision);
            replaceText(theirs);
          }}
          onKeepMine={keepMine}
        />
      )}
      {!chosen.own && (
        <Notice tone="info" role="status">
          <span data-testid="evaluating-other-cooler">
            Evaluating this document on <strong>{chosen.cooler.name}</strong> ({chosen.cooler.fanCount} × {fan.name}, {pump.name}). The profile still belongs to{" "}
            <strong>{cooler.name}</strong>: drafts and published versions are unchanged.
          </span>{" "}
          <button type="button" className="underline" onClick={() => setCoolerId(cooler.id)}>Back to {cooler.name}</button>
        </Notice>
      )}

      <div className="grid gap-5 xl:grid-cols-2">
        <div className="space-y-3">
          {/* The editor takes the window's height (less the header rows above it), never under 28rem. */}
          <div className="h-[calc(100vh-13rem)] min-h-[28rem] overflow-hidden rounded-md bg-white shadow-panel">
            <JsonEditor
              value={text}
              readOnly={!canWrite}
              label={`Profile ${profile.name} JSON`}
              issues={issues}
              onChange={onEdit}
              onReady={onReady}
            />
          </div>
          <MemoProblemsList issues={issues} onJump={onJump} />
        </div>
        <div className="space-y-5">
          <Panel title={`Speeds and sound against liquid temperature · ${chosen.cooler.name}`}>
            {plotted.stale && (
              <p role="status" className="mb-2 rounded bg-ink-100 px-3 py-2 text-sm text-ink-800" data-testid="stale-plots">
                {plotted.problem?.range
                  ? `The JSON has a problem at line ${plotted.problem.range.start.line}, column ${plotted.problem.range.start.column} (see Problems)`
                  : "The document does not pass the schema (see Problems)"}
                : these greyed plots are from the last version of the draft that did, not from the text on the left.
              </p>
            )}
            {plotted.evaluation && hw ? (
              <div className={plotted.stale ? "pointer-events-none [&_svg]:opacity-40 [&_svg]:grayscale" : undefined} aria-hidden={plotted.stale || undefined}>
                <LiveCurvePlot
                  rows={plotted.evaluation.rows}
                  limits={limits}
                  profile={plotted.evaluation.profile}
                  flashed={plotted.evaluation.flashed}
                  hw={hw}
                  operating={plotted.stale ? null : operatingMark}
                  editing={plotted.stale ? null : editing}
                />
              </div>
            ) : (
              <p className="text-sm text-ink-600">The plots appear once the document passes the schema.</p>
            )}
            <p className="mt-2 text-xs text-ink-600">
              Solid: as authored. Dashed: as the board runs it after storing in 0.5 °C / 0.5 % steps; a dashed ring marks where a point is stored when that differs.
              {editing && " Drag a point or use the arrow keys (Shift: 5 steps); Delete removes it; double-click the plot to add one. Every change is written into the JSON and undone with Ctrl+Z in the editor."}
            </p>
            <p role="status" className="mt-1 text-sm" data-testid="operating-readout">
              {operating && `At ${operating.heatLoadW} W and ${operating.ambientC} °C ambient the liquid settles at ${operating.liquidTempC.toFixed(1)} °C; about ${operating.soundDbA.toFixed(1)} dB(A) at 1 m${operating.atListener ? `, ${operating.atListener.soundDbA.toFixed(1)} dB(A) at ${operating.atListener.distanceM} m` : ""} (estimate).`}
            </p>
            <p role="status" className="mt-1 text-sm font-medium text-signal-fault" data-testid="edit-notice">
              {editing?.notice?.text}
            </p>
          </Panel>
          {deferredEvaluation?.profile && deferredHw && (
            <>
              {/* The table follows in the background pass: the plot is where a drag or a keystroke is watched. */}
              <Panel title="Points">
                <PointsTable profile={deferredEvaluation.profile} hw={deferredHw} editing={editing} />
              </Panel>
              <Panel title={`Operating point · ${deferredHw.name}`}>
                <MemoOperatingPanel profile={deferredEvaluation.profile} hw={deferredHw} point={deferredPoint} inputs={operatingInputs} onInputs={setOperatingInputs} />
              </Panel>
              <Panel title="Memory">
                <MemoMemoryGauge profile={deferredEvaluation.profile} revisions={revisions} boardRange={canWrite ? publishRange : (latest?.boardRange ?? null)} knownRanges={knownRanges} />
              </Panel>
            </>
          )}
        </div>
      </div>

      {canWrite && (
        <Panel title="Publish">
          <MemoPublishPanel profileId={profile.id} getText={getText} latest={latest} current={current} defaultRange={defaultRange} onRangeChange={setPublishRange} blocked={errors > 0 || !deferredEvaluation?.profile} />
        </Panel>
      )}
      <MemoVersionsPanel profileId={profile.id} versions={versions} />
    </div>
  );
}

/** The version history with its compare link: nothing here follows the keystrokes. */
const MemoVersionsPanel = memo(function VersionsPanel({ profileId, versions }: { profileId: string; versions: VersionView[] }) {
  return (
    <Panel title="Version history" actions={versions.length >= 2 ? <Link className="text-sm text-copper-700 underline" href={`/profiles/${profileId}/compare`}>Compare versions</Link> : undefined}>
      <VersionHistory profileId={profileId} versions={versions} />
    </Panel>
  );
});

/** Cooler and board revision choice, save state and import: nothing here follows the keystrokes. */
function WorkspaceHeader({
  detail,
  choices,
  chosenId,
  onCooler,
  loadError,
  revisionId,
  onRevision,
  canWrite,
  save,
  onImported,
}: {
  detail: ProfileDetailView;
  choices: CoolerChoice[];
  chosenId: string;
  onCooler: (id: string) => void;
  loadError: boolean;
  revisionId: string;
  onRevision: (id: string) => void;
  canWrite: boolean;
  save: SaveState;
  onImported: (text: string, draftRevision: number) => void;
}) {
  const { profile, cooler, revisions } = detail;
  return (
    <div className="flex flex-wrap items-end gap-4 rounded-md bg-white p-4 shadow-panel">
      <div className="text-sm">
        <span className="block font-medium text-ink-800">Profile for cooler model</span>
        <span data-testid="cooler-name">{cooler.name}</span> <span className="text-ink-600">({cooler.fanCount} × {detail.fan.name}, {detail.pump.name})</span>
      </div>
      <CoolerPicker choices={choices} value={chosenId} onChange={onCooler} loadError={loadError} />
      <label className="text-sm">
        <span className="mb-1 block font-medium text-ink-800">Board revision ({cooler.boardModelName})</span>
        <Select value={revisionId} onChange={(e) => onRevision(e.target.value)} className="w-64">
          {revisions.map((r) => (
            <option key={r.id} value={r.id}>{r.revision} · {r.memoryBytes} B · {r.maxPointsPerCurve} points</option>
          ))}
        </Select>
      </label>
      <div className="ml-auto flex items-center gap-3 text-sm">
        {canWrite ? (
          <>
            <span role="status" className="text-ink-600" data-testid="save-state">
              {save.kind === "saving" && "Saving draft…"}
              {save.kind === "saved" && "Draft saved"}
              {save.kind === "error" && <span className="text-signal-fault">Draft not saved: {save.message}</span>}
            </span>
            <ImportButton profileId={profile.id} onImported={onImported} />
          </>
        ) : (
          <span className="text-ink-600">Read only: your role may not edit profiles.</span>
        )}
      </div>
    </div>
  );
}
const MemoWorkspaceHeader = memo(WorkspaceHeader);
