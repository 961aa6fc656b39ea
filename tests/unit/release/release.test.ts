import { describe, expect, it } from "vitest";
import { checkBuild, type BuildSlotFacts } from "@/lib/release/build-check";
import { compareMeasurements, parseMeasurementsCsv, soundGateIssues, MEASUREMENT_HEADER } from "@/lib/release/measurements";
import { reviewStanding, type ReviewFacts } from "@/lib/release/approvals";
import { approvalGateIssues, validationGate } from "@/lib/release/gates";
import { capabilityFor, nextStage, transitionShapeError } from "@/lib/release/transitions";
import { checkUploadContent, uploadNameProblem } from "@/lib/release/upload-check";
import { messageBodyText } from "@/lib/mail/raw-message";
import { crc32, decodeBank, readIntelHex, writeIntelHex, type HardwareContext } from "@/lib/engine";
import { demoProfileDocument } from "@/db/seed/builds";
import { DEMO_COMPONENTS, DEMO_REVISIONS } from "@/db/seed/hardware";

const fan = DEMO_COMPONENTS[0]!;
const pump = DEMO_COMPONENTS[2]!;
const cooler = { name: "Test 240", radiatorMm: 240, fanCount: 2, radiatorKPerWAtMinFan: 0.11, radiatorKPerWAtMaxFan: 0.045 };

function slot(name: string, style: "balanced" | "quiet", boardRange = ">=1.0.0"): BuildSlotFacts {
  return { label: `${name} 1.0.0`, document: demoProfileDocument(name, style, fan.minDutyPct, pump.minDutyPct), version: "1.0.0", boardRange, contentHash: "ab".repeat(32), cooler, fan, pump };
}

describe("build check", () => {
  it("encodes a bank whose CRC-32 trailer covers every byte before it (zlib CRC-32, check value 0xCBF43926)", () => {
    const result = checkBuild({ revisionRange: ">=1.0.0 <3.0.0", revisions: DEMO_REVISIONS, slots: [slot("A", "balanced"), slot("B", "quiet")] });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const trailer = new DataView(result.image.buffer, result.image.byteOffset).getUint32(result.image.length - 4, true);
    expect(trailer).toBe(crc32(result.image, 0, 0, result.image.length - 4));
    expect(result.crc32).toBe(trailer);
    expect(decodeBank(result.image).ok).toBe(true);
    expect(result.revisions).toEqual(["1.0.0", "1.1.0", "2.0.0"]);
  });

  it("refuses an image larger than the smallest memory in the range, by how many bytes", () => {
    const small = DEMO_REVISIONS.map((r) => ({ ...r, memoryBytes: r.revision === "1.1.0" ? 64 : r.memoryBytes }));
    const result = checkBuild({ revisionRange: ">=1.0.0", revisions: small, slots: [slot("A", "balanced"), slot("B", "quiet")] });
    expect(result.ok).toBe(false);
    // 8-byte header + 2 slots of (15 fixed + 2×4 curve header + 2×8 point bytes) + 4-byte CRC = 90 bytes (docs/bank-format.md).
    expect(result.ok ? "" : result.issues.join(" ")).toContain("The bank image takes 90 bytes; revision 1.1.0 has 64 bytes of profile memory (26 bytes over).");
  });

  it("refuses more slots than the smallest revision has", () => {
    const result = checkBuild({ revisionRange: "1.0.0", revisions: DEMO_REVISIONS, slots: [slot("A", "balanced"), slot("B", "quiet"), slot("C", "quiet")] });
    expect(result.ok ? "" : result.issues.join(" ")).toContain("The build has 3 slots; revision 1.0.0 has 2 (1 too many).");
  });

  it("refuses a curve with more points than a revision holds, and an unsatisfied board range", () => {
    const long = slot("Long", "balanced");
    const doc = long.document as ReturnType<typeof demoProfileDocument>;
    doc.fans.points = [20, 25, 30, 35, 40, 45, 50].map((tempC, i) => ({ tempC, dutyPct: 30 + i * 10 }));
    const result = checkBuild({ revisionRange: ">=1.0.0", revisions: DEMO_REVISIONS, slots: [long, slot("New", "quiet", "^2.0.0")] });
    const text = result.ok ? "" : result.issues.join("\n");
    expect(text).toContain("Slot 1 (Long 1.0.0) has a curve of 7 points; revision 1.0.0 holds at most 6 (1 over).");
    expect(text).toContain("Slot 2 (New 1.0.0) is for board revisions ^2.0.0; revision 1.1.0 is in the build's range but not in it.");
  });

  it("refuses a range no revision is in", () => {
    const result = checkBuild({ revisionRange: "^9.0.0", revisions: DEMO_REVISIONS, slots: [slot("A", "balanced")] });
    expect(result.ok ? "" : result.issues[0]).toMatch(/No revision .* "\^9\.0\.0"/);
  });

  it("writes Intel HEX that reads back to the image at the revision base address (Intel HEX spec Rev. A)", () => {
    const result = checkBuild({ revisionRange: "2.0.0", revisions: DEMO_REVISIONS, slots: [slot("A", "balanced")] });
    if (!result.ok) throw new Error(result.issues.join());
    const back = readIntelHex(writeIntelHex(result.image, 0x0801f800));
    expect(back.ok).toBe(true);
    expect(back.startAddress).toBe(0x0801f800);
    expect([...back.bytes]).toEqual([...result.image]);
  });
});

describe("measurements against the estimate", () => {
  const hw: HardwareContext = {
    fan: { kind: "fan", minDutyPct: 20, rpmAtMinDuty: 450, maxRpm: 2000, tachPulsesPerRev: 2, soundRefDbA: 40, soundRefRpm: 2000, soundExponent: 50 },
    fanCount: 1,
    pump: { kind: "pump", minDutyPct: 40, rpmAtMinDuty: 1400, maxRpm: 2900, tachPulsesPerRev: 4, soundRefDbA: 40, soundRefRpm: 2900, soundExponent: 50, flowAtMaxRpmLpm: 1.4 },
    radiator: { thermalResistanceAtMinFanKPerW: 0.1, thermalResistanceAtMaxFanKPerW: 0.04 },
    boardRevision: { version: "1.0.0", memoryBytes: 256, baseAddress: 0, slotCount: 2, maxPointsPerCurve: 6, pwmFrequencyHz: 25000, tachPulsesPerRev: 2 },
  };

  it("estimates two equal 40 dB sources at their reference speeds as 43.01 dB (incoherent sum, common practice; ASHRAE Handbook — Fundamentals, 2021 edition, ch. 8 'Sound and Vibration', chapter from memory)", () => {
    const [row] = compareMeasurements([{ liquidTempC: 40, pumpRpm: 2900, fanRpm: 2000, soundDbA: 44, backgroundDbA: null }], hw, 3);
    expect(row!.estimatedDbA).toBeCloseTo(43.01, 2);
    expect(row!.deltaDb).toBeCloseTo(0.99, 2);
    expect(row!.withinTolerance).toBe(true);
  });

  it("scales the fan by 50·log10(N2/N1): halving its speed takes 15.05 dB off it (fan law for sound power; ASHRAE Handbook — HVAC Systems and Equipment, 2020 edition, ch. 21 'Fans', from memory)", () => {
    const [row] = compareMeasurements([{ liquidTempC: 40, pumpRpm: 2900, fanRpm: 1000, soundDbA: 40, backgroundDbA: null }], hw, 3);
    // By hand: fan 40 − 15.05 = 24.95 dB; with the 40 dB pump 10·log10(10^2.495 + 10^4) = 10·log10(312.6 + 10 000) = 40.13 dB.
    expect(row!.estimatedDbA).toBeCloseTo(40.13, 2);
  });

  it("fails the gate beyond the tolerance and names the worst point", () => {
    const rows = compareMeasurements([{ liquidTempC: 40, pumpRpm: 2900, fanRpm: 2000, soundDbA: 47.5, backgroundDbA: null }], hw, 3);
    expect(rows[0]!.withinTolerance).toBe(false);
    expect(soundGateIssues(rows, 3)[0]).toMatch(/1 of 1 comparable .* more than 3 dB .*47\.5 dB\(A\) after background correction against 43\.0 estimated at pump 2900 RPM, fans 2000 RPM/);
  });

  it("parses the lab CSV and names bad lines", () => {
    expect(parseMeasurementsCsv(`${MEASUREMENT_HEADER}\n40,2000,1200,31.5\n`)).toEqual({ ok: true, rows: [{ liquidTempC: 40, pumpRpm: 2000, fanRpm: 1200, soundDbA: 31.5, backgroundDbA: null }] });
    const bad = parseMeasurementsCsv(`${MEASUREMENT_HEADER}\n40,2000,1200\n40,abc,1200,30\n`);
    expect(bad).toEqual({ ok: false, errors: ["Line 2: expected 4 values, found 3.", "Line 3: pump_rpm must be a number from 0 to 20000."] });
    expect(parseMeasurementsCsv("temp,rpm\n1,2").ok).toBe(false);
  });

  it("reads the lab CSV with the same RFC 4180 reader as lots files: quoted cells, CRLF, blank lines", () => {
    // RFC 4180 §2 rules 5 and 6: any field may be enclosed in double quotes; lines end in CRLF.
    const text = `${MEASUREMENT_HEADER}\r\n"40","2000",1200,"31.5"\r\n\r\n   \r\n45,2200,1400,33\r\n`;
    expect(parseMeasurementsCsv(text)).toEqual({
      ok: true,
      rows: [
        { liquidTempC: 40, pumpRpm: 2000, fanRpm: 1200, soundDbA: 31.5, backgroundDbA: null },
        { liquidTempC: 45, pumpRpm: 2200, fanRpm: 1400, soundDbA: 33, backgroundDbA: null },
      ],
    });
    // A quoted comma stays inside its cell, so the row has four cells and the third is not a number.
    expect(parseMeasurementsCsv(`${MEASUREMENT_HEADER}\n40,2000,"1,200",31.5\n`)).toEqual({ ok: false, errors: ["Line 2: fan_rpm must be a number from 0 to 20000."] });
  });
});

describe("stages and approvals", () => {
  it("moves one stage at a time and withdraws only from review or later", () => {
    expect(nextStage("draft")).toBe("review");
    expect(nextStage("production")).toBeNull();
    expect(transitionShapeError("review", "validation")).toBeNull();
    expect(transitionShapeError("draft", "pilot")).toMatch(/moves to review next/);
    expect(transitionShapeError("draft", "withdrawn")).toMatch(/cannot be withdrawn/);
    expect(transitionShapeError("production", "withdrawn")).toBeNull();
    expect(capabilityFor("review")).toBe("build:create");
    expect(capabilityFor("production")).toBe("build:promote");
    expect(capabilityFor("withdrawn")).toBe("build:withdraw");
  });

  it("counts one approval per reviewer, none from authors, and blocks on open change requests", () => {
    const active = { reviewerRole: "engineer" as const, reviewerDisabledAt: null };
    const reviews = [
      { reviewerUserId: "a", verdict: "approve" as const, resolvedAt: null, ...active },
      { reviewerUserId: "a", verdict: "approve" as const, resolvedAt: null, ...active },
      { reviewerUserId: "author", verdict: "approve" as const, resolvedAt: null, ...active },
      { reviewerUserId: "b", verdict: "request_changes" as const, resolvedAt: null, ...active },
    ];
    const authorship = { buildAuthorUserId: "author", profileAuthorUserIds: new Set<string>() };
    expect(approvalGateIssues(reviews, authorship, 2)).toEqual([
      "The build has 1 of 2 required approvals from active reviewers who wrote neither the build nor its profile versions.",
      "1 change request is still open; the author must resolve it first.",
    ]);
    const resolved = reviews.map((r) => (r.verdict === "request_changes" ? { ...r, resolvedAt: "2026-01-01" } : r));
    expect(approvalGateIssues([...resolved, { reviewerUserId: "c", verdict: "approve", resolvedAt: null, ...active }], authorship, 2)).toEqual([]);
  });

  it("says why a review does not count: profile author, build author, disabled, role no longer allowed", () => {
    const authorship = { buildAuthorUserId: "builder", profileAuthorUserIds: new Set(["writer"]) };
    const approval = (reviewerUserId: string, extra: Partial<ReviewFacts> = {}): ReviewFacts => ({ reviewerUserId, verdict: "approve", resolvedAt: null, reviewerRole: "engineer", reviewerDisabledAt: null, ...extra });
    expect(reviewStanding(approval("ok"), authorship)).toEqual({ counts: true, reason: null });
    expect(reviewStanding(approval("writer"), authorship).reason).toMatch(/wrote a profile version in this build/);
    expect(reviewStanding(approval("builder"), authorship).reason).toMatch(/created this build/);
    expect(reviewStanding(approval("gone", { reviewerDisabledAt: "2026-01-02T00:00:00Z" }), authorship).reason).toMatch(/disabled/);
    expect(reviewStanding(approval("demoted", { reviewerRole: "viewer" }), authorship).reason).toMatch(/role is now Viewer, which may not review/);
    expect(reviewStanding(approval("asks", { verdict: "request_changes" }), authorship).counts).toBe(false);
    // A disabled reviewer and a demoted one leave one counting approval of two: the gate stays shut.
    const gate = validationGate([approval("ok"), approval("gone", { reviewerDisabledAt: new Date() }), approval("demoted", { reviewerRole: "support" })], authorship, 2);
    expect(gate.find((r) => r.key === "approvals")).toMatchObject({ state: "unmet", label: "Approvals 1 of 2" });
  });
});

describe("upload checks", () => {
  const enc = (s: string) => new TextEncoder().encode(s);
  it("refuses names that are paths or carry control characters", () => {
    for (const n of ["../../etc/passwd", "a/b.pdf", "C:\\x.bin", "x\u0000.pdf", "..", ""]) expect(uploadNameProblem(n)).not.toBeNull();
    expect(uploadNameProblem("lab report 3.pdf")).toBeNull();
  });
  it("judges the type by content: %PDF- magic, the CSV header, parsed Intel HEX", () => {
    expect(checkUploadContent("lab_report", "x.pdf", enc("%PDF-1.4\n"))).toEqual({ ok: true, contentType: "application/pdf" });
    expect(checkUploadContent("lab_report", "x.pdf", enc("PK\u0003\u0004")).ok).toBe(false);
    expect(checkUploadContent("measurements", "x.csv", enc(`${MEASUREMENT_HEADER}\n`)).ok).toBe(true);
    // Worked record from the Intel HEX references: all bytes sum to 0 mod 256.
    expect(checkUploadContent("firmware", "x.hex", enc(":10246200464C5549442050524F46494C4500464C33\n:00000001FF\n")).ok).toBe(true);
    expect(checkUploadContent("firmware", "x.hex", enc(":10246200464C5549442050524F46494C4500464C34\n:00000001FF\n")).ok).toBe(false);
    expect(checkUploadContent("firmware", "x.bin", new Uint8Array([0, 255, 3]))).toEqual({ ok: true, contentType: "application/octet-stream" });
  });
});

describe("raw message body", () => {
  it("decodes quoted-printable soft breaks and bytes (RFC 2045 §6.7)", () => {
    const raw = "Subject: x\r\nContent-Transfer-Encoding: quoted-printable\r\n\r\nLiquid 40 =C2=B0C, a long li=\r\nne\r\n";
    expect(messageBodyText(raw)).toBe("Liquid 40 °C, a long line");
  });
});
