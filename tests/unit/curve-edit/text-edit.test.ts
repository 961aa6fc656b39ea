import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { CoolingProfile, CurveKind } from "@/lib/engine";
import { applyTextEdit, changedSpan, CurveEditError, formatNumber, insertPointEdit, numberSpan, removePointEdit, setNumberEdit } from "@/lib/curve-edit";
import { quietProfile, readExample, validProfileArb } from "../engine/fixtures";

/*
 * The reference outside this module is the platform's own JSON: JSON.parse reads the edited
 * text back (ECMA-262 §25.5.1), and JSON.stringify with the same indentation writes the text an
 * author who typed the change by hand in that layout would have (§25.5.2).
 */
const layouts = [0, 2, 4, "\t"] as const;
// Large generated sizes: curves up to the generator's longest (8 points).
fc.configureGlobal({ baseSize: "large" });
const kinds: readonly CurveKind[] = ["pump", "fans"];

/** Offsets of the first and last character where two texts differ. */
function changedWindow(before: string, after: string): { prefix: number; suffix: number } {
  let prefix = 0;
  while (prefix < before.length && before[prefix] === after[prefix]) prefix++;
  let suffix = 0;
  while (suffix < before.length - prefix && before[before.length - 1 - suffix] === after[after.length - 1 - suffix]) suffix++;
  return { prefix, suffix };
}

describe("formatNumber", () => {
  it("writes numbers as typed, without binary leftovers", () => {
    expect(formatNumber(45)).toBe("45");
    expect(formatNumber(45.5)).toBe("45.5");
    expect(formatNumber(0.1 + 0.2)).toBe("0.3");
    expect(formatNumber(-0)).toBe("0");
    expect(formatNumber(100)).toBe("100");
    expect(() => formatNumber(Number.NaN)).toThrow(CurveEditError);
  });
});

describe("setNumberEdit", () => {
  it("changes exactly one number of a hand-formatted example and nothing else", () => {
    const text = readExample("quiet.profile.json");
    const doc = JSON.parse(text) as CoolingProfile;
    const edit = setNumberEdit(text, "/fans/points/1/dutyPct", 47.5);
    const after = applyTextEdit(text, edit);
    const { prefix, suffix } = changedWindow(text, after);
    // Only the token itself differs: the text before and after the old number is kept byte for byte.
    expect(prefix).toBeGreaterThanOrEqual(edit.start);
    expect(text.length - suffix).toBeLessThanOrEqual(edit.end);
    expect(after.slice(0, edit.start)).toBe(text.slice(0, edit.start));
    expect(after.slice(edit.start + edit.text.length)).toBe(text.slice(edit.end));
    doc.fans.points[1]!.dutyPct = 47.5;
    expect(JSON.parse(after)).toEqual(doc);
  });

  it("refuses pointers that name no number, and text that is not JSON", () => {
    const text = readExample("quiet.profile.json");
    expect(() => setNumberEdit(text, "/fans/points/99/dutyPct", 1)).toThrow(/no value/);
    expect(() => setNumberEdit(text, "/name", 1)).toThrow(/not a number/);
    expect(() => numberSpan(`${text.slice(0, 20)}`, "/name")).toThrow(/syntax error/);
  });

  it("on any valid profile in any indentation: parses back to the document with that one change, laid out as the same serializer writes it", () => {
    let largestCurve = 0;
    fc.assert(
      fc.property(
        validProfileArb,
        fc.constantFrom(...layouts),
        fc.constantFrom(...kinds),
        fc.nat(),
        fc.constantFrom("tempC" as const, "dutyPct" as const),
        fc.integer({ min: 0, max: 200 }).map((c) => c / 2),
        (doc, indent, kind, at, field, value) => {
          const text = `${JSON.stringify(doc, null, indent)}\n`;
          const index = at % doc[kind].points.length;
          largestCurve = Math.max(largestCurve, doc[kind].points.length);
          const after = applyTextEdit(text, setNumberEdit(text, `/${kind}/points/${index}/${field}`, value));
          const expected = structuredClone(doc);
          expected[kind].points[index]![field] = value;
          expect(JSON.parse(after)).toEqual(expected);
          expect(after).toBe(`${JSON.stringify(expected, null, indent)}\n`);
        },
      ),
      { numRuns: 300 },
    );
    // The generator reaches the longest curves it can make (8 points), not only tiny ones.
    expect(largestCurve).toBe(8);
  });
});

describe("insertPointEdit and removePointEdit", () => {
  it("insert then remove gives back the text byte for byte, and each step is what the serializer writes", () => {
    let largestCurve = 0;
    fc.assert(
      fc.property(validProfileArb, fc.constantFrom(...layouts), fc.constantFrom(...kinds), fc.nat(), (doc, indent, kind, at) => {
        const text = `${JSON.stringify(doc, null, indent)}\n`;
        const n = doc[kind].points.length;
        largestCurve = Math.max(largestCurve, n);
        const index = at % (n + 1);
        const point = { tempC: 12.5, dutyPct: 33 };
        const inserted = applyTextEdit(text, insertPointEdit(text, kind, index, point));
        const expected = structuredClone(doc);
        expected[kind].points.splice(index, 0, point);
        expect(inserted).toBe(`${JSON.stringify(expected, null, indent)}\n`);
        const removed = applyTextEdit(inserted, removePointEdit(inserted, kind, index));
        expect(removed).toBe(text);
      }),
      { numRuns: 300 },
    );
    expect(largestCurve).toBe(8);
  });

  it("keeps a point's own layout and key order when the author wrote points on one line, keys reversed", () => {
    const text = '{\n  "fans": {"points": [ {"dutyPct": 20, "tempC": 25},  {"dutyPct": 60, "tempC": 40} ]},\n  "name": "x"\n}\n';
    const inserted = applyTextEdit(text, insertPointEdit(text, "fans", 2, { tempC: 55, dutyPct: 100 }));
    expect(inserted).toBe('{\n  "fans": {"points": [ {"dutyPct": 20, "tempC": 25},  {"dutyPct": 60, "tempC": 40},  {"dutyPct": 100, "tempC": 55} ]},\n  "name": "x"\n}\n');
    const removedFirst = applyTextEdit(inserted, removePointEdit(inserted, "fans", 0));
    expect(removedFirst).toBe('{\n  "fans": {"points": [ {"dutyPct": 60, "tempC": 40},  {"dutyPct": 100, "tempC": 55} ]},\n  "name": "x"\n}\n');
  });

  it("keeps CRLF line breaks", () => {
    const text = `${JSON.stringify(quietProfile(), null, 2).replace(/\n/g, "\r\n")}\r\n`;
    const inserted = applyTextEdit(text, insertPointEdit(text, "pump", 1, { tempC: 31, dutyPct: 50 }));
    expect(inserted.replace(/\r\n/g, "")).not.toMatch(/\n/);
    expect((JSON.parse(inserted) as CoolingProfile).pump.points[1]).toEqual({ tempC: 31, dutyPct: 50 });
  });

  it("refuses indices outside the curve", () => {
    const text = readExample("quiet.profile.json");
    expect(() => removePointEdit(text, "fans", 40)).toThrow(CurveEditError);
    expect(() => insertPointEdit(text, "fans", -1, { tempC: 1, dutyPct: 1 })).toThrow(CurveEditError);
  });
});

describe("changedSpan: the one span an editor replaces to turn one text into another", () => {
  // The reference is plain string identity (ECMA-262 §22.1.3: slice and concatenation in UTF-16
  // code units): applying the span to the old text must give the new text exactly.
  it("turns any text into any other, replacing no more than the part between their common ends", () => {
    let longest = 0;
    fc.assert(
      fc.property(fc.string({ unit: "binary", maxLength: 4000, size: "xlarge" }), fc.string({ unit: "binary", maxLength: 400 }), fc.nat(), fc.nat(), (base, insert, a, b) => {
        longest = Math.max(longest, base.length);
        const from = Math.min(a, b) % (base.length + 1);
        const to = Math.max(a, b) % (base.length + 1);
        const [lo, hi] = from <= to ? [from, to] : [to, from];
        const after = base.slice(0, lo) + insert + base.slice(hi);
        const span = changedSpan(base, after);
        if (base === after) {
          // No edit at all: nothing to replace. (The property returns nothing: fast-check reads any returned value but true as a failure.)
          expect(span).toBeNull();
          return;
        }
        expect(span).not.toBeNull();
        expect(applyTextEdit(base, span!)).toBe(after);
        // Never wider than the edit that made the difference, give or take a kept pair.
        expect(span!.end - span!.start).toBeLessThanOrEqual(hi - lo + 2);
      }),
      { numRuns: 400 },
    );
    // A profile's text is 1–4 thousand characters: the generated texts reach that.
    expect(longest).toBeGreaterThan(1000);
  });

  it("replaces only the digits of a changed duty in a profile's text", () => {
    const text = readExample("quiet.profile.json");
    const doc = JSON.parse(text) as CoolingProfile;
    const changed = structuredClone(doc);
    changed.fans.points[1]!.dutyPct += 0.5;
    const before = `${JSON.stringify(doc, null, 2)}\n`;
    const after = `${JSON.stringify(changed, null, 2)}\n`;
    const span = changedSpan(before, after)!;
    expect(applyTextEdit(before, span)).toBe(after);
    expect(span.end - span.start).toBeLessThanOrEqual(String(doc.fans.points[1]!.dutyPct).length);
  });

  it("keeps surrogate pairs and CR LF whole", () => {
    // U+1F600 is the pair D83D DE00, U+1F601 is D83D DE01: they differ in the low half only.
    const pair = changedSpan("a\u{1F600}b", "a\u{1F601}b")!;
    expect(pair).toEqual({ start: 1, end: 3, text: "\u{1F601}" });
    // "\r\n" → "\r\r\n": the common end is "\r\n", so the kept break must not be split.
    const crlf = changedSpan("x\r\ny", "x\r\r\ny")!;
    expect(applyTextEdit("x\r\ny", crlf)).toBe("x\r\r\ny");
    expect(crlf.start === 1 || crlf.start === 3).toBe(true);
    expect(changedSpan("same", "same")).toBeNull();
  });
});
