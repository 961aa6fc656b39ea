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
  users_email_key: { message: "A user with this e-mail address already exists.", path: "/email" },
  api_tokens_hash_key: { message: "Creating the token collided with an existing one; try again." },
  components_name_key: { message: "Another component already has this name; pick a different one.", path: "/name" },
  components_min_duty_range: { message: "The minimum duty must be between 0 and 100 %.", path: "/minDutyPct" },
  components_rpm_order: { message: "The maximum speed must be above the speed at minimum duty, and both above 0 rpm.", path: "/maxRpm" },
  components_tach_pulses: { message: "Tachometer pulses per revolution are between 1 and 12.", path: "/tachPulsesPerRev" },
  profiles_cooler_name_key: { message: "This cooler model already has a profile with this name; pick a different one.", path: "/name" },
  profile_versions_profile_version_key: { message: "This profile already has a version with that number; publish the next one.", path: "/version" },
  builds_board_version_key: { message: "This board model already has a build with that version; pick the next one.", path: "/version" },
  builds_withdrawn_has_reason: { message: "Withdrawing a build needs a reason.", path: "/reason" },
  production_lots_code_key: { message: "A production lot with this lot code already exists.", path: "/lotCode" },
  production_lots_range_order: { message: "The last serial must not be below the first.", path: "/serialTo" },
  production_lots_no_overlap: { message: "These serials overlap a lot already recorded for this board model.", path: "/serialFrom" },
  uploads_storage_key_key: { message: "Storing the file collided with an existing one; upload it again." },
};

export function constraintIssues(constraint: string | undefined): { message: string; issues?: FieldIssue[] } | undefined {
  const known = constraint ? CONSTRAINT_MESSAGES[constraint] : undefined;
  if (!known) return undefined;
  return { message: known.message, ...(known.path ? { issues: [{ path: known.path, message: known.message }] } : {}) };
}
