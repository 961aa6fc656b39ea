import { describe, expect, it } from "vitest";
import { validateProfile, type CoolingProfile } from "@/lib/engine";
import { quietProfile } from "./fixtures";

const codes = (r: { issues: { code: string; path: string; severity: string }[] }): string[] => r.issues.map((i) => `${i.severity} ${i.code} ${i.path}`);
const edit = (fn: (p: CoolingProfile) => void): CoolingProfile => {
  const p = quietProfile();
  fn(p);
  return p;
};

describe("fan stop rules", () => {
  it("a fan stop with no hysteresis is a warning (the fans would chatter), with a band it is not", () => {
    const bare = validateProfile(edit((p) => (p.fans.hysteresisC = 0)));
    expect(codes(bare)).toContain("warning fans.stop_without_hysteresis /fans/hysteresisC");
    expect(bare.ok).toBe(true);
    expect(codes(validateProfile(quietProfile()))).not.toContain("warning fans.stop_without_hysteresis /fans/hysteresisC");
    // No stop temperature: a band of 0 °C only means the duty follows at once.
    const noStop = validateProfile(
      edit((p) => {
        p.fans.hysteresisC = 0;
        delete p.fans.stopBelowTempC;
      }),
    );
    expect(codes(noStop).filter((c) => c.includes("stop_without_hysteresis"))).toEqual([]);
  });
});
