import type { Operation } from "../operation";
import * as account from "./account";
import * as admin from "./admin";
import * as registry from "./registry";
import * as profiles from "./profiles";
import * as builds from "./builds";
import * as firmware from "./firmware";
import * as support from "./support";

function opsOf(mod: Record<string, unknown>): Operation[] {
  return Object.values(mod).filter(
    (v): v is Operation => typeof v === "object" && v !== null && "method" in v && "path" in v && "access" in v,
  );
}

/** Every /api/v1 operation; the OpenAPI document and the fuzz tests are generated from this list. */
export const allOperations: Operation[] = [
  ...opsOf(account),
  ...opsOf(admin),
  ...opsOf(registry),
  ...opsOf(profiles),
  ...opsOf(builds),
  ...opsOf(firmware),
  ...opsOf(support),
];
