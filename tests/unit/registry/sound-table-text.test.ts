import { describe, expect, it } from "vitest";
import { soundTableBody } from "@/lib/api/operations/registry-schemas";
import { formatSoundTableText, parseSoundTableText } from "@/lib/registry/sound-table-text";

describe("the component form's sound table text", () => {
  it("reads an optional distance line and one 'RPM dB(A)' pair per line", () => {
    expect(parseSoundTableText("at 0.5 m\n600 14\n1200, 24\n\n2000;33\n")).toEqual({
      distanceM: 0.5,
      points: [
        { rpm: 600, soundDbA: 14 },
        { rpm: 1200, soundDbA: 24 },
        { rpm: 2000, soundDbA: 33 },
      ],
    });
    expect(parseSoundTableText("600 14\n2000 33")?.distanceM).toBe(1);
    expect(parseSoundTableText("  \n ")).toBeNull();
  });

  it("writes text that reads back to the same table", () => {
    const table = { distanceM: 1, points: [{ rpm: 1400, soundDbA: 18 }, { rpm: 2900, soundDbA: 24 }] };
    expect(parseSoundTableText(formatSoundTableText(table))).toEqual(table);
    expect(formatSoundTableText(null)).toBe("");
  });

  it("leaves unreadable numbers for the request schema to name", () => {
    const bad = parseSoundTableText("600 loud\n2000 33");
    const r = soundTableBody.safeParse(bad);
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.path).toEqual(["points", 0, "soundDbA"]);
    expect(r.error?.issues[0]?.message).toBe("Enter the level as a number.");
  });

  it("the schema wants two points and rising speeds", () => {
    expect(soundTableBody.safeParse(parseSoundTableText("600 14")).error?.issues[0]?.message).toBe("Give at least 2 measured points (RPM and dB(A)).");
    expect(soundTableBody.safeParse(parseSoundTableText("1200 24\n600 14")).error?.issues[0]?.message).toBe("List the measurements by rising RPM, one per speed.");
  });
});
