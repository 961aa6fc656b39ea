import { describe, expect, it } from "vitest";
import { encodeBank } from "@/lib/engine";
import { bankBytesFromVersionImages, fitToRevisions } from "@/lib/release/bank-fit";
import { activeNavHref } from "@/components/shell/nav";
import { performanceProfile, quietProfile } from "./engine/fixtures";

const encodedLength = (slots: Parameters<typeof encodeBank>[0]): number => {
  const r = encodeBank(slots);
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.bytes.length;
};

describe("bank size on the new build form", () => {
  it("equals the length of the bank the encoder writes for the same versions", () => {
    // docs/bank-format.md: one 8-byte header and one 4-byte CRC around all slots; the encoder writes the real image.
    const quiet = { profile: quietProfile(), version: "1.0.0" };
    const perf = { profile: performanceProfile(), version: "2.0.0" };
    const single = [encodedLength([quiet]), encodedLength([perf])];
    expect(bankBytesFromVersionImages(single)).toBe(encodedLength([quiet, perf]));
    expect(bankBytesFromVersionImages([single[0]!, single[0]!, single[1]!])).toBe(encodedLength([quiet, quiet, perf]));
    expect(bankBytesFromVersionImages([])).toBe(0);
  });

  it("says which revisions the bank fits, by memory and by slot count", () => {
    const fit = fitToRevisions(300, 2, [
      { revision: "1.0.0", memoryBytes: 256, slotCount: 4 },
      { revision: "2.0.0", memoryBytes: 1024, slotCount: 1 },
      { revision: "3.0.0", memoryBytes: 300, slotCount: 2 },
    ]);
    expect(fit.map((f) => [f.revision, f.fitsMemory, f.fitsSlots, f.spareBytes])).toEqual([
      ["1.0.0", false, true, -44],
      ["2.0.0", true, false, 724],
      ["3.0.0", true, true, 0],
    ]);
  });
});

describe("sidebar", () => {
  const hrefs = ["/", "/profiles", "/builds", "/builds/new", "/lookup", "/admin/users"];
  it("highlights one entry: the most specific one the page lies under", () => {
    expect(activeNavHref("/builds/new", hrefs)).toBe("/builds/new");
    expect(activeNavHref("/builds", hrefs)).toBe("/builds");
    expect(activeNavHref("/builds/7a3e0c52-0000-4000-8000-000000000000", hrefs)).toBe("/builds");
    expect(activeNavHref("/", hrefs)).toBe("/");
    expect(activeNavHref("/profiles/x/compare", hrefs)).toBe("/profiles");
    expect(activeNavHref("/buildsx", hrefs)).toBeUndefined();
  });
});
