import { execFileSync } from "node:child_process";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { asc, eq, sql } from "drizzle-orm";
import { drizzle } from "drizzle-orm/node-postgres";
import { Client, Pool } from "pg";
import * as schema from "@/db/schema";
import { buildReviews, builds, buildTransitions, productionLots, uploads } from "@/db/schema";
import { seedDemo } from "@/db/seed";
import { gateIssues } from "@/lib/release/gates";
import { BACKGROUND_COLUMN } from "@/lib/release/measurements";
import { gateRequirements } from "@/lib/use-cases/builds/gate";
import { getStorage } from "@/lib/platform/storage";

// The demo is seeded into a database of its own, so what is checked is what a fresh install gets.
const sourceUrl = process.env.DATABASE_URL!;
const name = `loopkeeper_seed_${process.pid}_${Date.now()}`;
const url = (() => {
  const u = new URL(sourceUrl);
  u.pathname = `/${name}`;
  return u.toString();
})();
const adminUrl = (() => {
  const u = new URL(sourceUrl);
  u.pathname = "/postgres";
  return u.toString();
})();

let pool: Pool;
let db: ReturnType<typeof drizzle<typeof schema>>;

async function admin(query: string) {
  const c = new Client({ connectionString: adminUrl });
  await c.connect();
  try {
    await c.query(query);
  } finally {
    await c.end();
  }
}

async function counts() {
  const n = async (t: typeof builds | typeof buildReviews | typeof buildTransitions | typeof uploads | typeof productionLots) => (await db.select({ n: sql<number>`count(*)::int` }).from(t))[0]!.n;
  return { builds: await n(builds), reviews: await n(buildReviews), transitions: await n(buildTransitions), uploads: await n(uploads), lots: await n(productionLots) };
}

beforeAll(async () => {
  await admin(`create database "${name}"`);
  execFileSync("npx", ["tsx", "db/migrate.ts"], { stdio: "pipe", env: { ...process.env, DATABASE_URL: url } });
  await seedDemo(url);
  pool = new Pool({ connectionString: url, max: 2 });
  db = drizzle(pool, { schema });
}, 180_000);

afterAll(async () => {
  await pool?.end();
  await admin(`drop database if exists "${name}"`);
});

const LATE = ["pilot", "production", "withdrawn"] as const;

describe("the demo data passes its own gates", () => {
  it("gives every build at pilot or later eligible approvals, firmware, a lab report and in-tolerance measurements with a background column", async () => {
    const all = await db.select().from(builds);
    const late = all.filter((b) => (LATE as readonly string[]).includes(b.stage));
    // The demo has builds at pilot, at the factory and withdrawn, from both demo seeds.
    expect(late.length).toBeGreaterThanOrEqual(6);
    const mover = { role: "release_manager" as const };
    for (const b of late) {
      expect(b.firmwareUploadId, b.version).not.toBeNull();
      for (const to of ["validation", "pilot"] as const) {
        const issues = gateIssues(await gateRequirements(db, b, to, mover));
        expect(issues, `build ${b.version} into ${to}`).toEqual([]);
      }
      const [csv] = await db.select().from(uploads).where(eq(uploads.id, b.measurementsUploadId!));
      const text = (await getStorage().get(csv!.storageKey)).toString("utf8");
      expect(text.split("\n")[0]!.split(",")).toContain(BACKGROUND_COLUMN);
      // No waiver stands in for the measurements.
      expect(b.waiverReason).toBeNull();
    }
  });

  it("dates every build's history in calendar order, and every lot after its build reached the factory", async () => {
    const all = await db.select().from(builds);
    for (const b of all) {
      const steps = await db.select().from(buildTransitions).where(eq(buildTransitions.buildId, b.id)).orderBy(asc(buildTransitions.createdAt));
      let previous = b.createdAt.getTime();
      let stage: string = "draft";
      for (const s of steps) {
        expect(s.fromStage, `build ${b.version}`).toBe(stage);
        expect(s.createdAt.getTime(), `build ${b.version} → ${s.toStage}`).toBeGreaterThan(previous);
        previous = s.createdAt.getTime();
        stage = s.toStage;
      }
      expect(stage, `build ${b.version} ends where its row says`).toBe(b.stage);
      const validation = steps.find((s) => s.toStage === "validation");
      for (const r of await db.select().from(buildReviews).where(eq(buildReviews.buildId, b.id))) {
        expect(r.createdAt.getTime()).toBeGreaterThan(b.createdAt.getTime());
        if (validation) expect(r.createdAt.getTime()).toBeLessThan(validation.createdAt.getTime());
      }
      for (const lot of await db.select().from(productionLots).where(eq(productionLots.buildId, b.id))) {
        const released = steps.find((s) => s.toStage === "production");
        expect(released, `lot ${lot.lotCode} is on a build that reached the factory`).toBeDefined();
        expect(new Date(`${lot.producedOn}T23:59:59Z`).getTime(), `lot ${lot.lotCode}`).toBeGreaterThan(released!.createdAt.getTime());
      }
    }
  });

  it("changes nothing when seeded again", async () => {
    const before = await counts();
    await seedDemo(url);
    expect(await counts()).toEqual(before);
    expect(before.lots).toBeGreaterThanOrEqual(4);
  });
});
