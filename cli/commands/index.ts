import type { CliCommand } from "../args";
import { bankCommand } from "./bank";
import { evaluateCommand } from "./evaluate";
import { headerCommand } from "./header";
import { inspectCommand } from "./inspect";
import { tachCommand } from "./tach";
import { validateCommand } from "./validate";
import { vectorsCommand } from "./vectors";
import { verifyCommand } from "./verify";

/** Every command, in the order `loopkeeper --help` lists them. A new command is added here. */
export const COMMANDS: readonly CliCommand[] = [validateCommand, evaluateCommand, bankCommand, inspectCommand, verifyCommand, vectorsCommand, headerCommand, tachCommand];
