import type { SoundTable } from "@/lib/engine";

/**
 * The sound table as people type it in the component form: an optional first line
 * "at 0.5 m" (the measurement distance; 1 m when left out), then one measurement per
 * line, "RPM dB(A)" (spaces, tabs, commas or semicolons between). Empty text is no
 * table (null). Numbers that do not read are kept as NaN, so the request schema
 * (soundTableBody) says which field is wrong.
 */
export function parseSoundTableText(text: string): SoundTable | null {
  const lines = text
    .split(/\r?\n/)
    .map((l) => l.trim())
    .filter((l) => l !== "");
  if (lines.length === 0) return null;
  let distanceM = 1;
  const at = /^at\s+(\S+)\s*m?$/i.exec(lines[0]!);
  if (at) {
    distanceM = toNumber(at[1]!);
    lines.shift();
  }
  const points = lines.map((line) => {
    const [rpm = "", soundDbA = "", ...rest] = line.split(/[\s,;]+/);
    return { rpm: rest.length > 0 ? Number.NaN : toNumber(rpm), soundDbA: toNumber(soundDbA) };
  });
  return { distanceM, points };
}

/** The text parseSoundTableText reads back to the same table. */
export function formatSoundTableText(table: SoundTable | null): string {
  if (!table) return "";
  return [`at ${table.distanceM} m`, ...table.points.map((p) => `${p.rpm} ${p.soundDbA}`)].join("\n");
}

function toNumber(s: string): number {
  return s.trim() === "" ? Number.NaN : Number(s);
}
