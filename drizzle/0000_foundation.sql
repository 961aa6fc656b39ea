CREATE TYPE "public"."build_stage" AS ENUM('draft', 'review', 'validation', 'pilot', 'production', 'withdrawn');--> statement-breakpoint
CREATE TYPE "public"."component_kind" AS ENUM('fan', 'pump');--> statement-breakpoint
CREATE TYPE "public"."mail_status" AS ENUM('pending', 'sent', 'failed');--> statement-breakpoint
CREATE TYPE "public"."review_verdict" AS ENUM('approve', 'request_changes');--> statement-breakpoint
CREATE TYPE "public"."role" AS ENUM('admin', 'engineer', 'release_manager', 'support', 'viewer');--> statement-breakpoint
CREATE TYPE "public"."upload_kind" AS ENUM('firmware', 'lab_report', 'measurements', 'bank_bin', 'bank_hex', 'dump', 'lots_csv');--> statement-breakpoint
CREATE TABLE "api_tokens" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"name" text NOT NULL,
	"token_hash" text NOT NULL,
	"token_prefix" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"revoked_at" timestamp with time zone,
	"last_used_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "audit_events" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"actor_user_id" uuid,
	"actor_label" text NOT NULL,
	"action" text NOT NULL,
	"entity_type" text NOT NULL,
	"entity_id" text NOT NULL,
	"before" jsonb,
	"after" jsonb,
	"request_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "board_models" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"serial_prefix" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "board_revisions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"board_model_id" uuid NOT NULL,
	"revision" text NOT NULL,
	"memory_bytes" integer NOT NULL,
	"base_address" bigint NOT NULL,
	"slot_count" integer NOT NULL,
	"max_points_per_curve" integer NOT NULL,
	"pwm_frequency_hz" integer DEFAULT 25000 NOT NULL,
	"tach_pulses_per_rev" integer DEFAULT 2 NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "board_revisions_memory_positive" CHECK ("board_revisions"."memory_bytes" > 0),
	CONSTRAINT "board_revisions_slots_positive" CHECK ("board_revisions"."slot_count" between 1 and 16)
);
--> statement-breakpoint
CREATE TABLE "build_reviews" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"build_id" uuid NOT NULL,
	"reviewer_user_id" uuid NOT NULL,
	"verdict" "review_verdict" NOT NULL,
	"comment" text DEFAULT '' NOT NULL,
	"resolved_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "build_slots" (
	"build_id" uuid NOT NULL,
	"slot_index" integer NOT NULL,
	"profile_version_id" uuid NOT NULL,
	CONSTRAINT "build_slots_build_id_slot_index_pk" PRIMARY KEY("build_id","slot_index")
);
--> statement-breakpoint
CREATE TABLE "build_transitions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"build_id" uuid NOT NULL,
	"from_stage" "build_stage" NOT NULL,
	"to_stage" "build_stage" NOT NULL,
	"actor_user_id" uuid NOT NULL,
	"reason" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "builds" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"board_model_id" uuid NOT NULL,
	"version" text NOT NULL,
	"revision_range" text NOT NULL,
	"stage" "build_stage" DEFAULT 'draft' NOT NULL,
	"author_user_id" uuid NOT NULL,
	"firmware_upload_id" uuid,
	"lab_report_upload_id" uuid,
	"measurements_upload_id" uuid,
	"bank_image" "bytea",
	"bank_bytes" integer,
	"bank_sha256" text,
	"bank_crc32" bigint,
	"release_notes" text,
	"waiver_reason" text,
	"withdrawn_reason" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "builds_withdrawn_has_reason" CHECK ("builds"."stage" <> 'withdrawn' or "builds"."withdrawn_reason" is not null)
);
--> statement-breakpoint
CREATE TABLE "components" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"kind" "component_kind" NOT NULL,
	"name" text NOT NULL,
	"min_duty_pct" double precision NOT NULL,
	"rpm_at_min_duty" integer NOT NULL,
	"max_rpm" integer NOT NULL,
	"tach_pulses_per_rev" integer DEFAULT 2 NOT NULL,
	"ref_sound_dba" double precision NOT NULL,
	"ref_rpm" integer NOT NULL,
	"sound_exponent" double precision DEFAULT 50 NOT NULL,
	"flow_at_max_rpm_lpm" double precision,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "components_min_duty_range" CHECK ("components"."min_duty_pct" >= 0 and "components"."min_duty_pct" <= 100),
	CONSTRAINT "components_rpm_order" CHECK ("components"."rpm_at_min_duty" > 0 and "components"."max_rpm" > "components"."rpm_at_min_duty"),
	CONSTRAINT "components_tach_pulses" CHECK ("components"."tach_pulses_per_rev" between 1 and 12)
);
--> statement-breakpoint
CREATE TABLE "cooler_models" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"radiator_mm" integer NOT NULL,
	"fan_component_id" uuid NOT NULL,
	"fan_count" integer NOT NULL,
	"pump_component_id" uuid NOT NULL,
	"board_model_id" uuid NOT NULL,
	"radiator_k_per_w_at_min_fan" double precision NOT NULL,
	"radiator_k_per_w_at_max_fan" double precision NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "cooler_models_fan_count" CHECK ("cooler_models"."fan_count" between 1 and 12),
	CONSTRAINT "cooler_models_resistance_order" CHECK ("cooler_models"."radiator_k_per_w_at_max_fan" > 0 and "cooler_models"."radiator_k_per_w_at_min_fan" >= "cooler_models"."radiator_k_per_w_at_max_fan")
);
--> statement-breakpoint
CREATE TABLE "local_mailbox" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"from_address" text NOT NULL,
	"to_addresses" text[] NOT NULL,
	"subject" text NOT NULL,
	"raw" text NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "mail_outbox" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"to_addresses" text[] NOT NULL,
	"subject" text NOT NULL,
	"body_text" text NOT NULL,
	"status" "mail_status" DEFAULT 'pending' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"next_attempt_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_error" text,
	"sent_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "production_lots" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"lot_code" text NOT NULL,
	"board_model_id" uuid NOT NULL,
	"board_revision_id" uuid NOT NULL,
	"build_id" uuid NOT NULL,
	"serial_from" bigint NOT NULL,
	"serial_to" bigint NOT NULL,
	"produced_on" date NOT NULL,
	"line" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "production_lots_range_order" CHECK ("production_lots"."serial_from" >= 0 and "production_lots"."serial_to" >= "production_lots"."serial_from")
);
--> statement-breakpoint
CREATE TABLE "profile_versions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"profile_id" uuid NOT NULL,
	"version" text NOT NULL,
	"version_major" integer NOT NULL,
	"version_minor" integer NOT NULL,
	"version_patch" integer NOT NULL,
	"board_range" text NOT NULL,
	"document" jsonb NOT NULL,
	"encoded_bytes" integer NOT NULL,
	"crc32" bigint NOT NULL,
	"content_hash" text NOT NULL,
	"changelog" text NOT NULL,
	"author_user_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "profiles" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"cooler_model_id" uuid NOT NULL,
	"name" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"owner_user_id" uuid NOT NULL,
	"draft_document" jsonb,
	"draft_updated_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "rate_limits" (
	"key" text NOT NULL,
	"window_start" timestamp with time zone NOT NULL,
	"count" integer DEFAULT 0 NOT NULL,
	CONSTRAINT "rate_limits_key_window_start_pk" PRIMARY KEY("key","window_start")
);
--> statement-breakpoint
CREATE TABLE "recent_lookups" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"user_id" uuid NOT NULL,
	"serial" text NOT NULL,
	"found" boolean NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sign_in_attempts" (
	"key" text PRIMARY KEY NOT NULL,
	"failures" integer DEFAULT 0 NOT NULL,
	"window_started_at" timestamp with time zone DEFAULT now() NOT NULL,
	"locked_until" timestamp with time zone,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "uploads" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"kind" "upload_kind" NOT NULL,
	"storage_key" text NOT NULL,
	"original_name" text NOT NULL,
	"content_type" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"sha256" text NOT NULL,
	"uploaded_by_user_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "users" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"name" text NOT NULL,
	"role" "role" DEFAULT 'viewer' NOT NULL,
	"password_hash" text NOT NULL,
	"disabled_at" timestamp with time zone,
	"session_epoch" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "api_tokens" ADD CONSTRAINT "api_tokens_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_events" ADD CONSTRAINT "audit_events_actor_user_id_users_id_fk" FOREIGN KEY ("actor_user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "board_revisions" ADD CONSTRAINT "board_revisions_board_model_id_board_models_id_fk" FOREIGN KEY ("board_model_id") REFERENCES "public"."board_models"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_reviews" ADD CONSTRAINT "build_reviews_build_id_builds_id_fk" FOREIGN KEY ("build_id") REFERENCES "public"."builds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_reviews" ADD CONSTRAINT "build_reviews_reviewer_user_id_users_id_fk" FOREIGN KEY ("reviewer_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_slots" ADD CONSTRAINT "build_slots_build_id_builds_id_fk" FOREIGN KEY ("build_id") REFERENCES "public"."builds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_slots" ADD CONSTRAINT "build_slots_profile_version_id_profile_versions_id_fk" FOREIGN KEY ("profile_version_id") REFERENCES "public"."profile_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_transitions" ADD CONSTRAINT "build_transitions_build_id_builds_id_fk" FOREIGN KEY ("build_id") REFERENCES "public"."builds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_transitions" ADD CONSTRAINT "build_transitions_actor_user_id_users_id_fk" FOREIGN KEY ("actor_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "builds" ADD CONSTRAINT "builds_board_model_id_board_models_id_fk" FOREIGN KEY ("board_model_id") REFERENCES "public"."board_models"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "builds" ADD CONSTRAINT "builds_author_user_id_users_id_fk" FOREIGN KEY ("author_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "builds" ADD CONSTRAINT "builds_firmware_upload_id_uploads_id_fk" FOREIGN KEY ("firmware_upload_id") REFERENCES "public"."uploads"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "builds" ADD CONSTRAINT "builds_lab_report_upload_id_uploads_id_fk" FOREIGN KEY ("lab_report_upload_id") REFERENCES "public"."uploads"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "builds" ADD CONSTRAINT "builds_measurements_upload_id_uploads_id_fk" FOREIGN KEY ("measurements_upload_id") REFERENCES "public"."uploads"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cooler_models" ADD CONSTRAINT "cooler_models_fan_component_id_components_id_fk" FOREIGN KEY ("fan_component_id") REFERENCES "public"."components"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cooler_models" ADD CONSTRAINT "cooler_models_pump_component_id_components_id_fk" FOREIGN KEY ("pump_component_id") REFERENCES "public"."components"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cooler_models" ADD CONSTRAINT "cooler_models_board_model_id_board_models_id_fk" FOREIGN KEY ("board_model_id") REFERENCES "public"."board_models"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "production_lots" ADD CONSTRAINT "production_lots_board_model_id_board_models_id_fk" FOREIGN KEY ("board_model_id") REFERENCES "public"."board_models"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "production_lots" ADD CONSTRAINT "production_lots_board_revision_id_board_revisions_id_fk" FOREIGN KEY ("board_revision_id") REFERENCES "public"."board_revisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "production_lots" ADD CONSTRAINT "production_lots_build_id_builds_id_fk" FOREIGN KEY ("build_id") REFERENCES "public"."builds"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "profile_versions" ADD CONSTRAINT "profile_versions_profile_id_profiles_id_fk" FOREIGN KEY ("profile_id") REFERENCES "public"."profiles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "profile_versions" ADD CONSTRAINT "profile_versions_author_user_id_users_id_fk" FOREIGN KEY ("author_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "profiles" ADD CONSTRAINT "profiles_cooler_model_id_cooler_models_id_fk" FOREIGN KEY ("cooler_model_id") REFERENCES "public"."cooler_models"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "profiles" ADD CONSTRAINT "profiles_owner_user_id_users_id_fk" FOREIGN KEY ("owner_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recent_lookups" ADD CONSTRAINT "recent_lookups_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_uploaded_by_user_id_users_id_fk" FOREIGN KEY ("uploaded_by_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "api_tokens_hash_key" ON "api_tokens" USING btree ("token_hash");--> statement-breakpoint
CREATE INDEX "api_tokens_user_idx" ON "api_tokens" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "audit_events_entity_idx" ON "audit_events" USING btree ("entity_type","entity_id");--> statement-breakpoint
CREATE INDEX "audit_events_actor_idx" ON "audit_events" USING btree ("actor_user_id");--> statement-breakpoint
CREATE INDEX "audit_events_created_idx" ON "audit_events" USING btree ("created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "board_models_name_key" ON "board_models" USING btree ("name");--> statement-breakpoint
CREATE UNIQUE INDEX "board_models_serial_prefix_key" ON "board_models" USING btree ("serial_prefix");--> statement-breakpoint
CREATE UNIQUE INDEX "board_revisions_model_revision_key" ON "board_revisions" USING btree ("board_model_id","revision");--> statement-breakpoint
CREATE INDEX "board_revisions_model_idx" ON "board_revisions" USING btree ("board_model_id");--> statement-breakpoint
CREATE INDEX "build_reviews_build_idx" ON "build_reviews" USING btree ("build_id");--> statement-breakpoint
CREATE INDEX "build_reviews_reviewer_idx" ON "build_reviews" USING btree ("reviewer_user_id");--> statement-breakpoint
CREATE INDEX "build_slots_profile_version_idx" ON "build_slots" USING btree ("profile_version_id");--> statement-breakpoint
CREATE INDEX "build_transitions_build_idx" ON "build_transitions" USING btree ("build_id");--> statement-breakpoint
CREATE INDEX "build_transitions_actor_idx" ON "build_transitions" USING btree ("actor_user_id");--> statement-breakpoint
CREATE UNIQUE INDEX "builds_board_version_key" ON "builds" USING btree ("board_model_id","version");--> statement-breakpoint
CREATE INDEX "builds_board_idx" ON "builds" USING btree ("board_model_id");--> statement-breakpoint
CREATE INDEX "builds_stage_idx" ON "builds" USING btree ("stage");--> statement-breakpoint
CREATE INDEX "builds_author_idx" ON "builds" USING btree ("author_user_id");--> statement-breakpoint
CREATE INDEX "builds_firmware_idx" ON "builds" USING btree ("firmware_upload_id");--> statement-breakpoint
CREATE INDEX "builds_lab_report_idx" ON "builds" USING btree ("lab_report_upload_id");--> statement-breakpoint
CREATE INDEX "builds_measurements_idx" ON "builds" USING btree ("measurements_upload_id");--> statement-breakpoint
CREATE UNIQUE INDEX "components_name_key" ON "components" USING btree ("name");--> statement-breakpoint
CREATE UNIQUE INDEX "cooler_models_name_key" ON "cooler_models" USING btree ("name");--> statement-breakpoint
CREATE INDEX "cooler_models_fan_idx" ON "cooler_models" USING btree ("fan_component_id");--> statement-breakpoint
CREATE INDEX "cooler_models_pump_idx" ON "cooler_models" USING btree ("pump_component_id");--> statement-breakpoint
CREATE INDEX "cooler_models_board_idx" ON "cooler_models" USING btree ("board_model_id");--> statement-breakpoint
CREATE INDEX "local_mailbox_received_idx" ON "local_mailbox" USING btree ("received_at");--> statement-breakpoint
CREATE INDEX "mail_outbox_due_idx" ON "mail_outbox" USING btree ("status","next_attempt_at");--> statement-breakpoint
CREATE UNIQUE INDEX "production_lots_code_key" ON "production_lots" USING btree ("lot_code");--> statement-breakpoint
CREATE INDEX "production_lots_model_serial_idx" ON "production_lots" USING btree ("board_model_id","serial_from");--> statement-breakpoint
CREATE INDEX "production_lots_revision_idx" ON "production_lots" USING btree ("board_revision_id");--> statement-breakpoint
CREATE INDEX "production_lots_build_idx" ON "production_lots" USING btree ("build_id");--> statement-breakpoint
CREATE UNIQUE INDEX "profile_versions_profile_version_key" ON "profile_versions" USING btree ("profile_id","version");--> statement-breakpoint
CREATE INDEX "profile_versions_profile_idx" ON "profile_versions" USING btree ("profile_id");--> statement-breakpoint
CREATE INDEX "profile_versions_author_idx" ON "profile_versions" USING btree ("author_user_id");--> statement-breakpoint
CREATE INDEX "profile_versions_content_hash_idx" ON "profile_versions" USING btree ("content_hash");--> statement-breakpoint
CREATE UNIQUE INDEX "profiles_cooler_name_key" ON "profiles" USING btree ("cooler_model_id","name");--> statement-breakpoint
CREATE INDEX "profiles_cooler_idx" ON "profiles" USING btree ("cooler_model_id");--> statement-breakpoint
CREATE INDEX "profiles_owner_idx" ON "profiles" USING btree ("owner_user_id");--> statement-breakpoint
CREATE INDEX "recent_lookups_user_idx" ON "recent_lookups" USING btree ("user_id","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "uploads_storage_key_key" ON "uploads" USING btree ("storage_key");--> statement-breakpoint
CREATE INDEX "uploads_uploader_idx" ON "uploads" USING btree ("uploaded_by_user_id");--> statement-breakpoint
CREATE UNIQUE INDEX "users_email_key" ON "users" USING btree (lower("email"));