import { describe, expect, it } from "vitest";
import { hex32 } from "@/lib/hex/address";

describe("addresses are written one way: 0x and eight upper-case digits", () => {
  it("pads short addresses and keeps the full 32 bits", () => {
    // 0x08000000 is the start of on-chip flash on STM32 parts (ST RM0090 rev 19, §2.3 memory map; from memory).
    expect(hex32(0x0800f000)).toBe("0x0800F000");
    expect(hex32(0x08000000)).toBe("0x08000000");
    expect(hex32(0)).toBe("0x00000000");
    // CRC-32 of "123456789" is 0xCBF43926 (the check value of CRC-32/ISO-HDLC, Williams "A Painless Guide to CRC Error Detection Algorithms" §15).
    expect(hex32(0xcbf43926)).toBe("0xCBF43926");
  });
});
