import { demoProfileDocument } from "@/db/seed/builds";
import { encodeBank, type CoolingProfile } from "@/lib/engine";
import { performanceProfile, quietProfile } from "./fixtures";

/**
 * Bank images as the demo registry builds them: the example profiles, and the seeded
 * "Factory default" + "Low noise" pair for each demo fan (minimum duty 20 % and 25 %)
 * with the demo pump (40 %).
 */
export function demoBankImages(): { name: string; bytes: Uint8Array }[] {
  const slots = (docs: CoolingProfile[]) => docs.map((profile, i) => ({ profile, version: `1.${i}.0` }));
  const sets: { name: string; docs: CoolingProfile[] }[] = [
    { name: "examples quiet + performance", docs: [quietProfile(), performanceProfile()] },
    ...[20, 25].map((fanMin) => ({
      name: `demo pair, fan minimum ${fanMin} %`,
      docs: [demoProfileDocument("Factory default", "balanced", fanMin, 40), demoProfileDocument("Low noise", "quiet", fanMin, 40)],
    })),
  ];
  return sets.map(({ name, docs }) => {
    const r = encodeBank(slots(docs));
    if (!r.ok) throw new Error(`${name} does not encode: ${r.errors.map((e) => e.message).join("; ")}`);
    return { name, bytes: r.bytes };
  });
}
