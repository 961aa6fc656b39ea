import { realRpmFromReading, rpmFromTachHz, STANDARD_TACH_PULSES_PER_REV } from "../../lib/engine";
import { numberOption, parseArgs, UsageError } from "../args";
import type { CommandResult } from "../io";

export const TACH_USAGE = "tach --reading RPM --pulses P [--host-pulses 2] [--json]  |  tach --hz F [--pulses P] [--json]";

/** `tach`: real RPM from a host's reading (real = reading × host / p), or RPM from tach frequency (60·f/p). */
export function tachCommand(argv: readonly string[]): CommandResult {
  const args = parseArgs(argv, ["reading", "pulses", "host-pulses", "hz"], ["json"]);
  if (args.positionals.length > 0) throw new UsageError(`tach takes no files: ${TACH_USAGE}`);
  const reading = numberOption(args, "reading");
  const hz = numberOption(args, "hz");
  const hostPulses = numberOption(args, "host-pulses", STANDARD_TACH_PULSES_PER_REV)!;
  if ((reading === undefined) === (hz === undefined)) throw new UsageError(`Give either --reading or --hz: ${TACH_USAGE}`);
  if (hz !== undefined) {
    const pulses = numberOption(args, "pulses", STANDARD_TACH_PULSES_PER_REV)!;
    const rpm = rpmFromTachHz(hz, pulses);
    return { exitCode: 0, human: `${hz} Hz at ${pulses} pulses/rev = ${rpm.toFixed(0)} RPM.`, json: { ok: true, tachHz: hz, pulsesPerRev: pulses, rpm } };
  }
  const pulses = numberOption(args, "pulses");
  if (pulses === undefined) throw new UsageError(`--pulses is required with --reading: ${TACH_USAGE}`);
  const realRpm = realRpmFromReading(reading!, pulses, hostPulses);
  return {
    exitCode: 0,
    human: `A reading of ${reading} RPM (host assumes ${hostPulses} pulses/rev) from a ${pulses}-pulse motor is ${realRpm.toFixed(0)} RPM real.`,
    json: { ok: true, readingRpm: reading, motorPulsesPerRev: pulses, hostPulsesPerRev: hostPulses, realRpm },
  };
}
