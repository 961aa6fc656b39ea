import { afterAll, describe, expect, it } from "vitest";
import { randomBytes } from "node:crypto";
import { closeDb, demoActor, getDb } from "./support/db";
import { listBoardModels, listRevisionsOfModel } from "@/db/boards";
import { createBoardModel } from "@/lib/use-cases/registry/save-board-model";
import { createBoardRevision } from "@/lib/use-cases/registry/save-board-revision";
import { lotFormOptions } from "@/lib/use-cases/lots/read";

afterAll(async () => {
  await closeDb();
});

const revisionFields = { memoryBytes: 1024, baseAddress: 0x8000, slotCount: 4, maxPointsPerCurve: 8, pwmFrequencyHz: 25000, tachPulsesPerRev: 2, notes: "" };

describe("board revisions are listed in semantic-version order everywhere", () => {
  it("puts 2.0.0 before 9.1.0 before 10.0.0 (numeric, not text, precedence)", async () => {
    // Semantic Versioning 2.0.0, §11: major, minor and patch compare numerically, so
    // 2.0.0 < 9.1.0 < 10.0.0, while a text sort would put "10.0.0" first.
    const db = getDb();
    const actor = await demoActor("admin@tarnwell.example");
    const prefix = `R${randomBytes(3).toString("hex").toUpperCase()}`.slice(0, 8);
    const model = await createBoardModel(db, actor, { name: `Order probe ${prefix}`, serialPrefix: prefix, description: "" });
    for (const revision of ["10.0.0", "2.0.0", "9.1.0"]) await createBoardRevision(db, actor, { boardModelId: model.id, revision, ...revisionFields });

    expect((await listRevisionsOfModel(db, { boardModelId: model.id })).map((r) => r.revision)).toEqual(["2.0.0", "9.1.0", "10.0.0"]);
    expect((await listBoardModels(db)).find((m) => m.id === model.id)?.revisions.map((r) => r.revision)).toEqual(["2.0.0", "9.1.0", "10.0.0"]);
    expect((await lotFormOptions(db)).boardModels.find((m) => m.id === model.id)?.revisions).toEqual(["2.0.0", "9.1.0", "10.0.0"]);
  });
});
