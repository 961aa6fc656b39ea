import type { AccessRow } from "./types";
import { foundationRows } from "./foundation";
import { registryRows } from "./registry";
import { buildRows } from "./builds";
import { supportRows } from "./support";

/** Every page and API operation of the app; each area of the product adds its own file. */
export const ALL_ROWS: AccessRow[] = [...foundationRows, ...registryRows, ...buildRows, ...supportRows];
