import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq, like } from "drizzle-orm";
import { closeDb, getDb } from "./support/db";
import { chunksOf, demoMovers, freshDraftBuild } from "./support/builds";
import { builds, mailOutbox } from "@/db/schema";
import { attachEvidence } from "@/lib/use-cases/builds/evidence";
import { tinyPdf } from "@/db/seed/builds";
import { moveBuild, reviewBuild } from "@/lib/use-cases/builds/stages";
import { acceptUpload } from "@/lib/use-cases/builds/uploads";

// The lab's list for this run; background delivery must not reach anybody's SMTP server.
process.env.LAB_MAIL_LIST = "acoustics-lab@tarnwell.example, lab-lead@tarnwell.example";
process.env.SMTP_PORT = "1";

afterAll(closeDb);

let m: Awaited<ReturnType<typeof demoMovers>>;
beforeAll(async () => {
  m = await demoMovers();
});

async function mailsOf(version: string) {
  const rows = await getDb().select().from(mailOutbox).where(like(mailOutbox.subject, `%TC-1 cooler controller ${version} %`));
  return rows.map((r) => ({ subject: r.subject, to: r.toAddresses, body: r.bodyText }));
}

describe("stage mail", () => {
  it("asks only people who may approve the build, and tells release managers, the lab, the author and support of each stage", async () => {
    // engineer@ creates the build; engineer2@ wrote its profile versions, so neither may approve it.
    const b = await freshDraftBuild({ authorEmail: "engineer@tarnwell.example", profileAuthorEmail: "engineer2@tarnwell.example" });
    const [row] = await getDb().select().from(builds).where(eq(builds.id, b.id));
    const version = row!.version;
    const title = `TC-1 cooler controller ${version}`;

    await moveBuild(m.engineer, { id: b.id, from: "draft", to: "review" });
    let mails = await mailsOf(version);
    expect(mails.map((mail) => mail.subject)).toEqual([`[Loopkeeper] Build ${title} is waiting for your review`]);
    const asked = mails[0]!.to;
    expect(asked).toEqual(expect.arrayContaining([m.engineer3.label, m.admin.label]));
    for (const notAsked of ["engineer@tarnwell.example", "engineer2@tarnwell.example", "release@tarnwell.example", "support@tarnwell.example", "viewer@tarnwell.example"]) {
      expect(asked).not.toContain(notAsked);
    }
    expect(mails[0]!.body).toContain(`Teodor Quist asks you to review build ${title}.`);

    await reviewBuild(m.engineer3, { buildId: b.id, verdict: "approve", comment: "Looks right." });
    await reviewBuild(m.admin, { buildId: b.id, verdict: "approve", comment: "" });
    await moveBuild(m.release, { id: b.id, from: "review", to: "validation" });
    mails = await mailsOf(version);
    const validation = mails.find((mail) => mail.subject === `[Loopkeeper] Build ${title} has entered lab validation`);
    expect(validation?.to).toEqual(expect.arrayContaining(["release@tarnwell.example", "acoustics-lab@tarnwell.example", "lab-lead@tarnwell.example"]));
    expect(validation?.to).not.toContain("support@tarnwell.example");

    const who = { userId: m.release.userId, label: m.release.label };
    await acceptUpload(who, { kind: "lab_report", name: "report.pdf", body: chunksOf(tinyPdf("lab")), attach: (tx, u) => attachEvidence(tx, who, { buildId: b.id, kind: "lab_report", uploadId: u.id }) });
    // No measurements yet: the pilot gate needs a waiver to stand in for the sound comparison's CSV.
    const csv = Buffer.from("liquid_temp_c,pump_rpm,fan_rpm,sound_dba\n40,1800,1000,30\n");
    await acceptUpload(who, { kind: "measurements", name: "m.csv", body: chunksOf(csv), attach: (tx, u) => attachEvidence(tx, who, { buildId: b.id, kind: "measurements", uploadId: u.id }) });
    const { recordWaiver } = await import("@/lib/use-cases/builds/waiver");
    await recordWaiver(getDb(), m.release, { buildId: b.id, reason: "Mail test: the sound comparison is not what is under test." });
    await moveBuild(m.release, { id: b.id, from: "validation", to: "pilot" });
    await moveBuild(m.release, { id: b.id, from: "pilot", to: "production", releaseNotes: "First factory run." });

    mails = await mailsOf(version);
    const pilot = mails.find((mail) => mail.subject === `[Loopkeeper] Build ${title} has entered the pilot run`);
    expect(pilot?.to).toEqual(expect.arrayContaining(["release@tarnwell.example", "engineer@tarnwell.example"]));
    const factory = mails.find((mail) => mail.subject === `[Loopkeeper] Build ${title} was released to the factory`);
    expect(factory?.to).toEqual(expect.arrayContaining(["release@tarnwell.example", "support@tarnwell.example", "engineer@tarnwell.example"]));
    expect(factory?.body).toContain("Release notes: First factory run.");
    // Every subject and the first line of every body is a sentence naming the build.
    for (const mail of mails) {
      expect(mail.subject).toContain(title);
      expect(mail.body.split("\n")[0]).toMatch(new RegExp(`^[A-Z].* build ${title.replace(/\./g, "\\.")}[ ;,.]`));
    }
  });
});
