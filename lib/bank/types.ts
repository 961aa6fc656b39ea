import type { SlotCodes } from "../firmware/codes";
import type { SignatureBlock } from "../signing/signature-block";
import type { ProfileSettings } from "../profile/types";

/** A problem found while encoding or decoding a bank image. */
export interface BankIssue {
  code: string;
  message: string;
  /** Byte offset in the image the problem is at, when known. */
  offset?: number;
  /** For mismatches: the value the image says (e.g. stored CRC). */
  expected?: number;
  /** For mismatches: the value found (e.g. computed CRC). */
  actual?: number;
}

/** One profile version to put in a slot. */
export interface BankSlotInput {
  profile: ProfileSettings;
  /** Semantic version x.y.z, each part 0–255 (no pre-release: the board stores 3 bytes). */
  version: string;
  /**
   * Hex of the content hash (at least 16 hex digits) of the profile version's
   * canonical JSON. Computed from `profile` with contentHashHex when left out.
   */
  contentHashHex?: string;
}

/** A slot read back from an image. */
export interface DecodedSlot {
  index: number;
  /** Byte offset of the slot in the image. */
  offset: number;
  /** 16 lower-case hex digits: first 8 bytes of the content hash. */
  contentHashPrefix: string;
  version: string;
  /** Quantised settings as stored. */
  settings: ProfileSettings;
  /** The stored integers themselves, as firmware reads them. */
  codes: SlotCodes;
}

/** A slot the header announces but whose bytes cannot be read as a slot. */
export interface UndecodableSlot {
  index: number;
  /** Byte offset where the slot was expected. */
  offset: number;
  code: string;
  reason: string;
}

export type EncodeBankResult = { ok: true; bytes: Uint8Array } | { ok: false; errors: BankIssue[] };

export interface DecodeBankResult {
  /** True when header, CRC and every slot are sound. */
  ok: boolean;
  formatVersion?: number;
  slotCount?: number;
  /** Length the header gives, bytes (the image may be followed by unused memory). */
  byteLength?: number;
  crc?: { stored: number; computed: number };
  /** The signature block a board with room stores right after the CRC, when present. */
  signatureBlock?: SignatureBlock;
  /** Slots that could be read (also when the CRC does not match, to help support). */
  slots: DecodedSlot[];
  /** Slots the header announces that could not be read, each with why. */
  undecodable: UndecodableSlot[];
  errors: BankIssue[];
}
