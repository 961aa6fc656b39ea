import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, getDb } from "./support/db";
import { chunksOf, demoMovers, freshDraftBuild } from "./support/builds";
import { builds } from "@/db/schema";
import { attachEvidence } from "@/lib/use-cases/builds/evidence";
import { tinyPdf } from "@/db/seed/builds";
import { AppError } from "@/lib/api/errors";
import { MEASUREMENT_HEADER_WITH_BACKGROUND } from "@/lib/release/measurements";
import { buildDetail } from "@/lib/use-cases/builds/detail";
import { buildGate } from "@/lib/use-cases/builds/gate";
import { moveBuild, reviewBuild } from "@/lib/use-cases/builds/stages";
import { acceptUpload } from "@/lib/use-cases/builds/uploads";

// Background delivery after a transition must not reach anybody's SMTP server.
process.env.SMTP_PORT = "1";

afterAll(closeDb);

let m: Awaited<ReturnType<typeof demoMovers>>;
beforeAll(async () => {
  m = await demoMovers();
});

/*
 * The demo Tarn 240: two fans at 33 dB(A) at 2000 RPM and a pump at 24 dB(A) at 2900 RPM,
 * fan-law exponent 50 (L = Lref + 50·log10(N/Nref)), two fans +10·log10(2), sources added
 * incoherently (10·log10(Σ10^(L/10))). The cooler alone, worked by hand:
 *   pump 1400, fans  600: fans 9.87, pump 8.19 → 12.12 dB(A)
 *   pump 1600, fans  900: 19.37 dB(A)
 *   pump 1800, fans 1100: 23.50 dB(A)
 *   pump 2600, fans 1800: 33.98 dB(A)
 *   pump 2900, fans 2000: 36.28 dB(A)
 * In a 22 dB(A) room (a quiet lab, common practice 20–25 dB(A)) the low-speed points are heard
 * within 6 dB of the room; ISO 3744:2010 §8.2.3 sets them aside as not comparable.
 */
const REALISTIC = [
  "25,1400,600,23.0,22", // ΔL 1.0 dB: too close to background
  "35,1800,1100,25.8", // ΔL 3.8 dB (background once, on the first row): too close
  "50,2600,1800,34.3", // ΔL 12.3 dB: K1 = −10·log10(1 − 10^(−1.23)) = 0.26 dB → 34.04, +0.06 dB over the estimate
  "55,2900,2000,36.4", // ΔL 14.4 dB: K1 = 0.16 dB → 36.24, −0.04 dB
];

async function inValidation() {
  const b = await freshDraftBuild();
  await moveBuild(m.engineer, { id: b.id, from: "draft", to: "review" });
  await reviewBuild(m.engineer2, { buildId: b.id, verdict: "approve", comment: "" });
  await reviewBuild(m.engineer3, { buildId: b.id, verdict: "approve", comment: "" });
  await moveBuild(m.release, { id: b.id, from: "review", to: "validation" });
  const who = { userId: m.release.userId, label: m.release.label };
  await acceptUpload(who, { kind: "lab_report", name: "report.pdf", body: chunksOf(tinyPdf("lab")), attach: (tx, u) => attachEvidence(tx, who, { buildId: b.id, kind: "lab_report", uploadId: u.id }) });
  return {
    id: b.id,
    attachCsv: (rows: string[]) =>
      acceptUpload(who, {
        kind: "measurements",
        name: "lab.csv",
        body: chunksOf(Buffer.from([MEASUREMENT_HEADER_WITH_BACKGROUND, ...rows].join("\n") + "\n")),
        attach: (tx, u) => attachEvidence(tx, who, { buildId: b.id, kind: "measurements", uploadId: u.id }),
      }),
  };
}

const soundLine = async (id: string) => (await buildGate(getDb(), { id }, m.release)).next?.requirements.find((r) => r.key === "sound");

describe("the sound gate on realistic lab files", () => {
  it("passes a file from a 22 dB(A) room without a waiver, the low-speed points marked too close to background", async () => {
    const b = await inValidation();
    await b.attachCsv(REALISTIC);
    const detail = await buildDetail(getDb(), { id: b.id });
    expect(detail.comparison.state).toBe("ok");
    if (detail.comparison.state === "ok") {
      expect(detail.comparison.rows.map((r) => r.status)).toEqual(["too_close_to_background", "too_close_to_background", "within", "within"]);
      expect(detail.comparison.rows[2]!.correctionDb).toBeCloseTo(0.264, 2);
    }
    expect(await soundLine(b.id)).toMatchObject({ state: "met", detail: "2 of 4 points compared, none louder than the estimate by more than 3 dB; 2 too close to background to compare." });
    await moveBuild(m.release, { id: b.id, from: "validation", to: "pilot" });
    const [row] = await getDb().select().from(builds).where(eq(builds.id, b.id));
    expect(row).toMatchObject({ stage: "pilot", waiverReason: null });
  });

  it("fails the same file with one high-speed point 5 dB above the estimate after correction", async () => {
    const b = await inValidation();
    // 41.4 over 22: ΔL 19.4 dB, no correction; 41.4 − 36.28 = 5.1 dB over a 3 dB tolerance.
    await b.attachCsv([...REALISTIC.slice(0, 3), "55,2900,2000,41.4"]);
    expect((await soundLine(b.id))?.state).toBe("unmet");
    const err = await moveBuild(m.release, { id: b.id, from: "validation", to: "pilot" }).then(() => null, (e: unknown) => e);
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).issues?.map((i) => i.message).join(" ")).toMatch(/^1 of 2 comparable measured sound levels exceed the estimate by more than 3 dB \(worst: 41\.4 dB\(A\).*pump 2900 RPM, fans 2000 RPM\)/);
  });

  it("says so when every point is too close to background, asking for a quieter room or a waiver", async () => {
    const b = await inValidation();
    await b.attachCsv(["25,1400,600,23.0,22", "30,1600,900,23.9", "35,1800,1100,25.8"]);
    expect(await soundLine(b.id)).toMatchObject({
      state: "unmet",
      detail:
        "All 3 measured points are within 6 dB of the room's background, so none can be compared with the estimate (ISO 3744:2010 §8.2.3 background criterion). Measure in a quieter room, or record a waiver with a reason.",
    });
  });
});
