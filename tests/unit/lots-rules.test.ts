import { describe, expect, it } from "vitest";
import { lotSerials, resolveLotKeys, type LotKeys } from "@/lib/lots/rules";
import type { LotInput } from "@/lib/lots/input";

const lot: LotInput = { lotCode: "L-1", boardRevision: "1.1.0", buildVersion: "3.0.0", serialFrom: "TC1-00000100", serialTo: "TC1-00000199", producedOn: "2025-04-01", line: "Line A" };
const serials = lotSerials(lot)!;
const model = { id: "m", name: "TC-1 cooler controller" };
const revision = { id: "r", revision: "1.1.0" };
const build = (stage: NonNullable<LotKeys["build"]>["stage"], revisionRange = ">=1.0.0 <2.0.0") => ({ id: "b", version: "3.0.0", stage, revisionRange });

describe("which builds and revisions a production lot may name", () => {
  it("accepts a build at pilot or production whose range holds the revision, with the serial numbers as stored", () => {
    for (const stage of ["pilot", "production"] as const) {
      const r = resolveLotKeys(lot, serials, { model, revision, build: build(stage) });
      expect(r.issues).toEqual([]);
      expect(r.resolved).toMatchObject({ boardModelId: "m", boardRevisionId: "r", buildId: "b", serialFrom: 100, serialTo: 199 });
    }
  });

  it("refuses a build the factory may not flash yet, or any more (draft, review, lab validation, withdrawn)", () => {
    for (const stage of ["draft", "review", "validation", "withdrawn"] as const) {
      const r = resolveLotKeys(lot, serials, { model, revision, build: build(stage) });
      expect(r.resolved).toBeUndefined();
      expect(r.issues).toEqual([{ field: "buildVersion", message: `Build 3.0.0 is at stage "${stage}"; lots may only name builds at pilot or production.` }]);
    }
  });

  it("refuses a revision outside the build's range by semver precedence, not text order", () => {
    // Semantic Versioning 2.0.0 §11: 10.0.0 > 2.0.0, so ">=2.0.0" holds 10.0.0 while text order would not;
    // node-semver range syntax: "<2.0.0" excludes 2.0.0 itself.
    const ten = { id: "r10", revision: "10.0.0" };
    expect(resolveLotKeys({ ...lot, boardRevision: "10.0.0" }, serials, { model, revision: ten, build: build("production", ">=2.0.0") }).issues).toEqual([]);
    const two = { id: "r2", revision: "2.0.0" };
    expect(resolveLotKeys({ ...lot, boardRevision: "2.0.0" }, serials, { model, revision: two, build: build("production", ">=1.0.0 <2.0.0") }).issues).toEqual([
      { field: "boardRevision", message: "Build 3.0.0 is for board revisions >=1.0.0 <2.0.0; revision 2.0.0 is outside it." },
    ]);
  });

  it("names each key storage did not find: the prefix alone when no board model has it, otherwise revision and build together", () => {
    expect(resolveLotKeys(lot, serials, {}).issues).toEqual([{ field: "serialFrom", message: "No board model uses the serial prefix TC1." }]);
    expect(resolveLotKeys(lot, serials, { model }).issues).toEqual([
      { field: "boardRevision", message: "TC-1 cooler controller has no revision 1.1.0." },
      { field: "buildVersion", message: "TC-1 cooler controller has no build 3.0.0." },
    ]);
  });
});
