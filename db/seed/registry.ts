import { and, eq } from "drizzle-orm";
import type { Database } from "../client";
import { boardModels, boardRevisions, coolerModels, profiles, profileVersions, users } from "../schema";
import { insertPublishedVersion } from "../profile-versions";
import { getCoolerHardware } from "../profiles";
import { buildVersionImage } from "@/lib/registry/version-image";
import { storedVersionParts } from "@/lib/versioning/stored-version";
import { DEMO_BOARD } from "./hardware";
import type { CoolingProfile } from "@/lib/engine";
import { documentText } from "@/lib/registry/starter-profile";

/** An engineering-sample revision with a tiny EEPROM, so the demo shows a profile that does not fit. */
const SAMPLE_REVISION = { revision: "0.9.0", memoryBytes: 96, baseAddress: 0x0800f000, slotCount: 1, maxPointsPerCurve: 16, pwmFrequencyHz: 25000, tachPulsesPerRev: 2, notes: "Engineering sample; 96-byte EEPROM, never shipped." };

type Pt = [tempC: number, dutyPct: number];
const curve = (pts: Pt[], hysteresisC = 2, rampUpPctPerSec = 10, rampDownPctPerSec = 3) => ({
  points: pts.map(([tempC, dutyPct]) => ({ tempC, dutyPct })),
  hysteresisC,
  rampUpPctPerSec,
  rampDownPctPerSec,
});

function doc(name: string, description: string, pump: Pt[], fans: Pt[], stopBelowTempC?: number): CoolingProfile {
  return {
    formatVersion: 1,
    name,
    description,
    criticalTempC: 60,
    sensorLossDutyPct: 100,
    pump: curve(pump),
    fans: { ...curve(fans, 1.5), ...(stopBelowTempC !== undefined ? { stopBelowTempC } : {}) },
  };
}

/** 16 evenly spaced points from 20 °C to 57.5 °C, rising from `fromPct` to 100 %. */
const sixteen = (fromPct: number): Pt[] => Array.from({ length: 16 }, (_, i) => [20 + i * 2.5, Math.min(100, Math.ceil((fromPct + ((100 - fromPct) * i) / 15) * 2) / 2)]);

interface DemoVersion {
  version: string;
  boardRange: string;
  changelog: string;
  document: CoolingProfile;
}
interface DemoProfile {
  cooler: string;
  name: string;
  description: string;
  owner: string;
  versions: DemoVersion[];
}

const hushPump: Pt[] = [[20, 40], [35, 50], [45, 70], [55, 100]];
const hushFans: Pt[] = [[30, 25], [40, 40], [50, 70], [58, 100]];

export const DEMO_PROFILES: DemoProfile[] = [
  {
    cooler: "Tarn 360",
    name: "Hush",
    description: "Low noise for everyday work; fans rest while the liquid is cool.",
    owner: "engineer@tarnwell.example",
    versions: [
      { version: "1.0.0", boardRange: ">=1.0.0 <3.0.0", changelog: "First release.", document: doc("Hush", "Low noise for everyday work.", hushPump, hushFans, 30) },
      { version: "1.1.0", boardRange: ">=1.0.0 <3.0.0", changelog: "Fans reach 40 % two degrees later.", document: doc("Hush", "Low noise for everyday work.", hushPump, [[30, 25], [42, 40], [50, 70], [58, 100]], 30) },
      { version: "1.1.1", boardRange: ">=1.0.0 <3.0.0", changelog: "Description only.", document: doc("Hush", "Low noise for everyday work; fans rest while the liquid is cool.", hushPump, [[30, 25], [42, 40], [50, 70], [58, 100]], 30) },
    ],
  },
  {
    cooler: "Tarn 360",
    name: "Balanced",
    description: "Default shipping profile.",
    owner: "engineer2@tarnwell.example",
    versions: [
      { version: "1.0.0", boardRange: ">=1.0.0 <3.0.0", changelog: "First release.", document: doc("Balanced", "Default shipping profile.", [[20, 45], [30, 50], [40, 65], [50, 85], [56, 100]], [[20, 30], [30, 35], [40, 55], [50, 80], [56, 100]]) },
      { version: "1.1.0", boardRange: ">=1.0.0 <3.0.0", changelog: "Pump a little quicker above 40 °C.", document: doc("Balanced", "Default shipping profile.", [[20, 45], [30, 50], [40, 70], [50, 90], [56, 100]], [[20, 30], [30, 35], [40, 55], [50, 80], [56, 100]]) },
    ],
  },
  {
    cooler: "Tarn 360",
    name: "Surge",
    description: "Full cooling for sustained render and compile loads.",
    owner: "engineer@tarnwell.example",
    versions: [
      {
        version: "1.0.0",
        boardRange: ">=1.1.0",
        changelog: "First release; needs the 8-point boards.",
        document: doc("Surge", "Full cooling for sustained loads.", [[20, 60], [25, 65], [30, 70], [35, 75], [40, 80], [45, 88], [50, 95], [54, 100]], [[20, 40], [25, 45], [30, 50], [35, 60], [40, 70], [45, 80], [50, 90], [54, 100]]),
      },
      {
        version: "2.0.0",
        boardRange: ">=2.0.0",
        changelog: "Sixteen-point curves for smoother steps; flash-page boards only.",
        document: doc("Surge", "Full cooling for sustained loads, fine steps.", sixteen(60), sixteen(40)),
      },
    ],
  },
  {
    cooler: "Tarn 240",
    name: "Quiet office",
    description: "For small cases under a desk.",
    owner: "engineer@tarnwell.example",
    versions: [
      { version: "1.0.0", boardRange: ">=1.0.0 <3.0.0", changelog: "First release.", document: doc("Quiet office", "For small cases under a desk.", [[20, 40], [40, 55], [50, 80], [57, 100]], [[25, 20], [40, 40], [50, 75], [57, 100]], 28) },
      { version: "1.1.0", boardRange: ">=1.0.0 <3.0.0", changelog: "Fans stop below 30 °C instead of 28 °C.", document: doc("Quiet office", "For small cases under a desk.", [[20, 40], [40, 55], [50, 80], [57, 100]], [[25, 20], [40, 40], [50, 75], [57, 100]], 30) },
    ],
  },
  {
    cooler: "Tarn 240",
    name: "Render",
    description: "Long all-core loads on the 240 mm cooler.",
    owner: "engineer2@tarnwell.example",
    versions: [
      { version: "1.0.0", boardRange: ">=1.0.0", changelog: "First release.", document: doc("Render", "Long all-core loads.", [[20, 50], [30, 60], [40, 75], [45, 85], [50, 95], [55, 100]], [[20, 30], [30, 45], [40, 65], [45, 80], [50, 92], [55, 100]]) },
      { version: "1.0.1", boardRange: ">=1.0.0", changelog: "Description only.", document: doc("Render", "Long all-core loads on the 240 mm cooler.", [[20, 50], [30, 60], [40, 75], [45, 85], [50, 95], [55, 100]], [[20, 30], [30, 45], [40, 65], [45, 80], [50, 92], [55, 100]]) },
      { version: "1.1.0", boardRange: ">=1.0.0", changelog: "Fans earlier above 40 °C.", document: doc("Render", "Long all-core loads on the 240 mm cooler.", [[20, 50], [30, 60], [40, 75], [45, 85], [50, 95], [55, 100]], [[20, 30], [30, 45], [40, 70], [45, 85], [50, 95], [55, 100]]) },
    ],
  },
];

/** Demo profiles and their published versions, through the app's own publish function. Idempotent. */
export async function seedRegistry(db: Database): Promise<void> {
  const [board] = await db.select().from(boardModels).where(eq(boardModels.name, DEMO_BOARD.name));
  if (!board) throw new Error("seed the hardware first");
  await db.insert(boardRevisions).values({ ...SAMPLE_REVISION, boardModelId: board.id }).onConflictDoNothing();
  for (const p of DEMO_PROFILES) {
    const [cooler] = await db.select().from(coolerModels).where(eq(coolerModels.name, p.cooler));
    const [owner] = await db.select().from(users).where(eq(users.email, p.owner));
    if (!cooler || !owner) throw new Error(`demo cooler ${p.cooler} or user ${p.owner} missing`);
    const last = p.versions[p.versions.length - 1]!;
    await db
      .insert(profiles)
      .values({ coolerModelId: cooler.id, name: p.name, description: p.description, ownerUserId: owner.id, draftText: documentText(last.document), draftDocument: last.document, draftUpdatedAt: new Date() })
      .onConflictDoNothing();
    const [profile] = await db.select().from(profiles).where(and(eq(profiles.coolerModelId, cooler.id), eq(profiles.name, p.name)));
    if (!profile) throw new Error(`demo profile ${p.name} missing`);
    const have = new Set((await db.select({ v: profileVersions.version }).from(profileVersions).where(eq(profileVersions.profileId, profile.id))).map((r) => r.v));
    for (const v of p.versions) {
      if (have.has(v.version)) continue;
      // The same image the publish use case builds; the demo versions pass its checks by construction.
      const hw = await getCoolerHardware(db, { coolerModelId: cooler.id });
      const parts = storedVersionParts(v.version);
      const built = hw && buildVersionImage({ text: documentText(v.document), version: v.version, boardRange: v.boardRange, cooler: hw.cooler, fan: hw.fan, pump: hw.pump, revisions: hw.revisions });
      if (!built?.ok || !parts) throw new Error(`demo version ${p.name} ${v.version} does not build: ${built && !built.ok ? built.message : "no hardware or bad number"}`);
      await db.transaction((tx) =>
        insertPublishedVersion(tx, { userId: owner.id, label: `${owner.email} (demo seed)` }, { profileId: profile.id, version: v.version, parts, boardRange: v.boardRange, changelog: v.changelog, image: built.image }),
      );
    }
  }
}
