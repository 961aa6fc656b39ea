import "server-only";
import type { FieldIssue } from "@/lib/api/errors";

/**
 * What each named PostgreSQL constraint means to the person who tripped it, and which
 * field to fix. Constraints are the last guard (e.g. two editors racing for one name);
 * the message must still say what to change, not name the constraint.
 */
export const CONSTRAINT_MESSAGES: Record<string, { message: string; path?: string }> = {
  board_models_name_key: { message: "Another board model already has this name; pick a different one.", path: "/name" },
  board_models_serial_prefix_key: { message: "Another board model already uses this serial prefix; serials must identify one model.", path: "/serialPrefix" },
  board_revisions_model_revision_key: { message: "This board model already has a revision with that number.", path: "/revision" },
  board_revisions_memory_positive: { message: "The profile memory must be above 0 bytes.", path: "/memoryBytes" },
  board_revisions_slots_positive: { message: "A revision has between 1 and 16 profile slots.", path: "/slotCount" },
  cooler_models_name_key: { message: "Another cooler model already has this name; pick a different one.", path: "/name" },
  cooler_models_fan_count: { message: "A cooler has between 1 and 12 fans.", path: "/fanCount" },
  cooler_models_resistance_order: {
    message: "The radiator resistance at maximum fan speed must be above 0 and not exceed the one at minimum.",
    path: "/radiatorKPerWAtMaxFan",
  },
  cooler_models_fan_component_id_components_id_fk: { message: "The chosen fan no longer exists; pick another.", path: "/fanComponentId" },
  cooler_models_pump_component_id_components_id_fk: { message: "The chosen pump no longer exists; pick another.", path: "/pumpComponentId" },
  build_reviews_build_reviewer_key: { message: "You already reviewed this build; one review per reviewer. To change your verdict, use \"Change my verdict\"." },
  cooler_models_board_model_id_board_models_id_fk: { message: "The chosen board model no longer exists; pick another.", path: "/boardModelId" },
};

export function constraintIssues(constraint: string | undefined): { message: string; issues?: FieldIssue[] } | undefined {
  const known = constraint ? CONSTRAINT_MESSAGES[constraint] : undefined;
  if (!known) return undefined;
  return { message: known.message, ...(known.path ? { issues: [{ path: known.path, message: known.message }] } : {}) };
}
