import { realRpmFromReading, rpmFromTachHz, STANDARD_TACH_PULSES_PER_REV } from "../../lib/engine";
import { defineCommand, UsageError } from "../args";

/** Same range as `tachPulsesPerRev` in the hardware-context schema. */
const PULSES = { min: 1, max: 8 } as const;

/** `tach`: real RPM from a host's reading (real = reading × host / p), or RPM from tach frequency (60·f/p). */
export const tachCommand = defineCommand({
  name: "tach",
  summary: "convert a tach reading or frequency to real RPM for a motor with a given number of pulses per revolution.",
  positionals: null,
  options: {
    reading: { kind: "number", value: "RPM", description: "speed the host reports, assuming --host-pulses pulses per revolution" },
    hz: { kind: "number", value: "F", description: "tach signal frequency in Hz, instead of --reading" },
    pulses: { kind: "integer", value: "P", description: `pulses per revolution the motor gives, a whole number ${PULSES.min}–${PULSES.max}; required with --reading`, defaultText: `${STANDARD_TACH_PULSES_PER_REV} with --hz` },
    "host-pulses": { kind: "integer", value: "P", description: `pulses per revolution the host assumes, ${PULSES.min}–${PULSES.max}`, defaultText: String(STANDARD_TACH_PULSES_PER_REV) },
  },
  examples: ["tach --reading 5600 --pulses 4", "tach --hz 50"],
  notes: ["real RPM = reading × host pulses / motor pulses;  RPM = 60 × Hz / pulses."],
  run(args) {
    const reading = args.number("reading");
    const hz = args.number("hz");
    const pulsesGiven = args.integer("pulses", { ...PULSES, what: "the motor's pulses per revolution" });
    const hostPulses = args.integer("host-pulses", { ...PULSES, what: "the host's pulses per revolution" }) ?? STANDARD_TACH_PULSES_PER_REV;
    if ((reading === undefined) === (hz === undefined)) throw new UsageError("Give either --reading or --hz (one of them), e.g. loopkeeper tach --reading 5600 --pulses 4.");
    if (hz !== undefined) {
      const pulses = pulsesGiven ?? STANDARD_TACH_PULSES_PER_REV;
      const rpm = rpmFromTachHz(hz, pulses);
      return { exitCode: 0, human: `${hz} Hz at ${pulses} pulses/rev = ${rpm.toFixed(0)} RPM.`, json: { ok: true, tachHz: hz, pulsesPerRev: pulses, rpm } };
    }
    if (pulsesGiven === undefined) throw new UsageError("--pulses is required with --reading: how many pulses per revolution the motor gives, e.g. --pulses 4.");
    const realRpm = realRpmFromReading(reading!, pulsesGiven, hostPulses);
    return {
      exitCode: 0,
      human: `A reading of ${reading} RPM (host assumes ${hostPulses} pulses/rev) from a ${pulsesGiven}-pulse motor is ${realRpm.toFixed(0)} RPM real.`,
      json: { ok: true, readingRpm: reading, motorPulsesPerRev: pulsesGiven, hostPulsesPerRev: hostPulses, realRpm },
    };
  },
});
