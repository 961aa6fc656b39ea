import { z } from "zod";
import { valid as validSemver } from "semver";
import { parseSerial } from "../serials/serial";

const serialText = (what: string) =>
  z
    .string(`Enter the ${what} serial, e.g. TC1-00012345.`)
    .trim()
    .max(40)
    .refine((s) => parseSerial(s).ok, { message: `The ${what} serial must be the board prefix, a dash and up to 8 digits, e.g. TC1-00012345.` });

const semverText = (what: string) =>
  z
    .string(`Enter the ${what}.`)
    .trim()
    .min(1, `Enter the ${what}.`)
    .max(64)
    .refine((s) => validSemver(s) !== null, { message: `The ${what} must be a semantic version such as 1.1.0.` });

/**
 * One production lot as a person, a CSV row or a factory station gives it: natural
 * keys only (board revision and build version; the board model follows from the
 * serial prefix). The form, the CSV import and POST /api/v1/lots share this schema.
 */
export const lotInput = z
  .strictObject({
    lotCode: z
      .string("Enter a lot code.")
      .trim()
      .regex(/^[A-Za-z0-9][A-Za-z0-9._/-]{1,39}$/, "A lot code is 2–40 letters, digits, dots, dashes or slashes, e.g. L24-0117."),
    boardRevision: semverText("board revision"),
    buildVersion: semverText("build version"),
    serialFrom: serialText("first"),
    serialTo: serialText("last"),
    producedOn: z.iso.date("Give the production date as YYYY-MM-DD."),
    line: z.string("Enter the production line.").trim().min(1, "Enter the production line.").max(40, "At most 40 characters."),
  })
  .superRefine((v, ctx) => {
    const from = parseSerial(v.serialFrom);
    const to = parseSerial(v.serialTo);
    if (!from.ok || !to.ok) return;
    if (from.serial.prefix !== to.serial.prefix) {
      ctx.addIssue({ code: "custom", path: ["serialTo"], message: `First and last serial must share one prefix (${from.serial.prefix} vs ${to.serial.prefix}).` });
    } else if (to.serial.number < from.serial.number) {
      ctx.addIssue({ code: "custom", path: ["serialTo"], message: "The last serial must not be below the first." });
    }
  });
export type LotInput = z.infer<typeof lotInput>;

export { LOT_CSV_COLUMNS } from "./csv-columns";
