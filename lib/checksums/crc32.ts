/**
 * CRC-32/ISO-HDLC — the zlib / IEEE 802.3 CRC: polynomial 0x04C11DB7 reflected
 * (0xEDB88320), init 0xFFFFFFFF, final xor 0xFFFFFFFF. Check value of ASCII
 * "123456789" is 0xCBF43926 (Greg Cook, "Catalogue of parametrised CRC
 * algorithms"). Table-driven, plain TypeScript so it runs in the browser.
 */
const TABLE = (() => {
  const table = new Uint32Array(256);
  for (let n = 0; n < 256; n++) {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    table[n] = c >>> 0;
  }
  return table;
})();

/**
 * CRC-32 of `bytes[start, end)`, optionally continuing from a previous CRC
 * (pass the earlier result as `previous`, as zlib's crc32(data, value) does).
 */
export function crc32(bytes: Uint8Array, previous = 0, start = 0, end = bytes.length): number {
  let c = (previous ^ 0xffffffff) >>> 0;
  for (let i = start; i < end; i++) c = TABLE[(c ^ bytes[i]!) & 0xff]! ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}
