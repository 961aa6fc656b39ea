import { EngineInputError, requireFinite } from "../guards/input-error";
import { EOF_RECORD, formatRecord, RECORD_DATA, RECORD_EXTENDED_LINEAR } from "./record";

/**
 * Intel HEX text of `bytes` placed at `baseAddress`: a type-04 extended linear
 * address record for address bits 16–31 (again at every 64 KiB boundary),
 * 16-byte type-00 data records, and the end-of-file record `:00000001FF`
 * (Intel, "Hexadecimal Object File Format Specification", Rev. A). Lines end
 * with "\n". Throws EngineInputError when the data would pass 0xFFFFFFFF.
 */
export function writeIntelHex(bytes: Uint8Array, baseAddress: number, recordBytes = 16): string {
  requireFinite("baseAddress", baseAddress, 0, 0xffffffff);
  requireFinite("recordBytes", recordBytes, 1, 255);
  if (baseAddress + bytes.length > 0x1_0000_0000) {
    throw new EngineInputError("baseAddress", "the data would run past 0xFFFFFFFF; use a lower base address");
  }
  const lines: string[] = [];
  let upper = -1;
  let i = 0;
  while (i < bytes.length) {
    const address = baseAddress + i;
    const addrUpper = Math.floor(address / 0x10000);
    if (addrUpper !== upper) {
      upper = addrUpper;
      lines.push(formatRecord(RECORD_EXTENDED_LINEAR, 0, [(upper >> 8) & 0xff, upper & 0xff]));
    }
    const low = address & 0xffff;
    // A record never crosses a 64 KiB boundary, so its 16-bit offset cannot wrap.
    const n = Math.min(recordBytes, bytes.length - i, 0x10000 - low);
    lines.push(formatRecord(RECORD_DATA, low, bytes.subarray(i, i + n)));
    i += n;
  }
  lines.push(EOF_RECORD);
  return `${lines.join("\n")}\n`;
}
