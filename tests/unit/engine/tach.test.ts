import { describe, expect, it } from "vitest";
import { EngineInputError, readingFromRealRpm, realRpmFromReading, rpmFromPulsePeriodMs, rpmFromTachHz } from "@/lib/engine";

describe("tach", () => {
  it("converts tach frequency to RPM with 2 pulses per revolution", () => {
    // Intel, "4-Wire Pulse Width Modulation (PWM) Controlled Fans Specification", Rev 1.3, §2.1.3: 50 Hz → 1,500 RPM.
    expect(rpmFromTachHz(50)).toBeCloseTo(1500, 9);
    expect(rpmFromTachHz(50, 2)).toBeCloseTo(1500, 9);
  });

  it("converts the time between pulses to RPM", () => {
    // Intel 4-Wire PWM fan spec rev 1.3 §2.1.3: 20 ms between pulses → 1,500 RPM.
    expect(rpmFromPulsePeriodMs(20)).toBeCloseTo(1500, 9);
  });

  it("general form RPM = 60·f/p, computed from the rule", () => {
    for (const [hz, p] of [[100, 4], [33.3, 1], [7, 3]] as const) {
      expect(rpmFromTachHz(hz, p)).toBeCloseTo((60 * hz) / p, 9);
    }
  });

  it("real speed of a 4-pulse pump read by a 2-pulse host is half the reading", () => {
    // Common practice (no published source): pumps often give 4 pulses per revolution, so a host shows twice the real speed.
    expect(realRpmFromReading(5600, 4)).toBeCloseTo(2800, 9);
    expect(realRpmFromReading(1500, 2)).toBeCloseTo(1500, 9);
    expect(realRpmFromReading(1000, 1)).toBeCloseTo(2000, 9);
  });

  it("reading and real speed convert back and forth", () => {
    for (const p of [1, 2, 3, 4, 6, 8]) expect(realRpmFromReading(readingFromRealRpm(1234, p), p)).toBeCloseTo(1234, 9);
  });

  it("rejects bad input with a named parameter", () => {
    expect(() => realRpmFromReading(Number.NaN, 2)).toThrow(EngineInputError);
    expect(() => realRpmFromReading(1000, 0)).toThrow(/motorPulsesPerRev/);
    expect(() => rpmFromTachHz(-1)).toThrow(/tachHz/);
    expect(() => rpmFromPulsePeriodMs(0)).toThrow(/periodMs/);
    expect(() => rpmFromTachHz("50" as unknown as number)).toThrow(/expected a finite number/);
  });
});
