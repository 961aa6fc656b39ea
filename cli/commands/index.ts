import type { CliCommand } from "../args";
import { bankCommand } from "./bank";
import { evaluateCommand } from "./evaluate";
import { inspectCommand } from "./inspect";
import { tachCommand } from "./tach";
import { validateCommand } from "./validate";
import { verifyCommand } from "./verify";

/** Every command, in the order `loopkeeper --help` lists them. A new command is added here. */
export const COMMANDS: readonly CliCommand[] = [validateCommand, evaluateCommand, bankCommand, inspectCommand, verifyCommand, tachCommand];
