import { describe, expect, it } from "vitest";
import { realRpmFromReading } from "@/lib/engine";
import { checkPumpSpeed } from "@/lib/support/tach-check";

// Datasheet-style pump figures (invented demo part): 1,200 RPM at minimum duty, 2,800 RPM at 100 %.
const pump = { rpmAtMinDuty: 1200, maxRpm: 2800 };

describe("pump speed from a customer's tach reading", () => {
  it("a 4-pulse pump at full speed, read by a host that counts 2 pulses (Intel 4-Wire PWM fan spec rev 1.3 §2.1.3), is fine once converted", () => {
    // The host shows twice the real speed: 5,600 RPM for 2,800 RPM real (common practice).
    const real = realRpmFromReading(5600, 4);
    expect(real).toBe(2800);
    expect(checkPumpSpeed(real, pump, 4).kind).toBe("ok");
  });

  it("the same reading converted with 2 pulses gives a speed the pump cannot run: wrong pulses per revolution", () => {
    const finding = checkPumpSpeed(realRpmFromReading(5600, 2), pump, 2);
    expect(finding.kind).toBe("above_max");
    expect(finding.kind !== "ok" && finding.message).toMatch(/pulses per revolution \(2\) are probably wrong/);
  });

  it("a real speed well under the lowest running speed points at a failing pump; 0 at a stopped one", () => {
    const slow = checkPumpSpeed(realRpmFromReading(1600, 4), pump, 4); // 800 RPM real
    expect(slow.kind).toBe("below_min");
    expect(slow.kind !== "ok" && slow.message).toMatch(/may be failing/);
    expect(checkPumpSpeed(0, pump, 4).kind).toBe("stopped");
  });

  it("speeds within the usual ±10 % spread around the datasheet range are not flagged", () => {
    expect(checkPumpSpeed(1100, pump, 4).kind).toBe("ok");
    expect(checkPumpSpeed(3000, pump, 4).kind).toBe("ok");
    expect(checkPumpSpeed(1070, pump, 4).kind).toBe("below_min");
    expect(checkPumpSpeed(3090, pump, 4).kind).toBe("above_max");
  });
});
