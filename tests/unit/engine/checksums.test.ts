import { createHash, randomBytes } from "node:crypto";
import zlib from "node:zlib";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { canonicalJson, contentHashHex, crc32, sha256, toHex } from "@/lib/engine";

const ascii = (s: string): Uint8Array => new TextEncoder().encode(s);

describe("CRC-32", () => {
  it('check value of "123456789" is 0xCBF43926', () => {
    // Greg Cook, "Catalogue of parametrised CRC algorithms" (reveng): CRC-32/ISO-HDLC check = 0xCBF43926.
    expect(crc32(ascii("123456789"))).toBe(0xcbf43926);
  });

  it("empty input gives 0", () => {
    expect(crc32(new Uint8Array(0))).toBe(0);
  });

  it("matches Node's zlib.crc32 on random data, whole and continued", () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 2048 }), fc.nat(), (bytes, cut) => {
        const at = bytes.length === 0 ? 0 : cut % bytes.length;
        expect(crc32(bytes)).toBe(zlib.crc32(bytes));
        expect(crc32(bytes.subarray(at), crc32(bytes.subarray(0, at)))).toBe(zlib.crc32(bytes));
      }),
    );
    const big = new Uint8Array(randomBytes(100_000));
    expect(crc32(big)).toBe(zlib.crc32(big));
  });
});

describe("SHA-256", () => {
  it('"abc" gives the FIPS 180-4 example digest', () => {
    // NIST FIPS 180-4 example "abc" (SHA-256 one-block message).
    expect(toHex(sha256(ascii("abc")))).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });

  it("matches node:crypto on random data including block-boundary lengths", () => {
    for (const n of [0, 1, 55, 56, 63, 64, 65, 119, 120, 1000]) {
      const b = new Uint8Array(randomBytes(n));
      expect(toHex(sha256(b))).toBe(createHash("sha256").update(b).digest("hex"));
    }
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 600 }), (b) => {
        expect(toHex(sha256(b))).toBe(createHash("sha256").update(b).digest("hex"));
      }),
    );
  });
});

describe("canonical JSON and content hash", () => {
  it("ignores key order and whitespace, keeps array order", () => {
    expect(canonicalJson({ b: 1, a: [2, { d: 1, c: 2 }] })).toBe('{"a":[2,{"c":2,"d":1}],"b":1}');
    expect(contentHashHex(JSON.parse('{ "x": 1, "y": 2 }'))).toBe(contentHashHex({ y: 2, x: 1 }));
    expect(contentHashHex([1, 2])).not.toBe(contentHashHex([2, 1]));
  });

  it("hash is SHA-256 of the canonical text", () => {
    const doc = { name: "Hush", z: [1.5, null, true] };
    expect(contentHashHex(doc)).toBe(createHash("sha256").update(canonicalJson(doc), "utf8").digest("hex"));
  });
});
