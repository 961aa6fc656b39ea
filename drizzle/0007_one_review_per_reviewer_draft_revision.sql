ALTER TABLE "build_reviews" ADD COLUMN "updated_at" timestamp with time zone DEFAULT now() NOT NULL;--> statement-breakpoint
ALTER TABLE "profiles" ADD COLUMN "draft_revision" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "profiles" ADD COLUMN "draft_saved_by_user_id" uuid;--> statement-breakpoint
ALTER TABLE "profiles" ADD CONSTRAINT "profiles_draft_saved_by_user_id_users_id_fk" FOREIGN KEY ("draft_saved_by_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
-- Databases from before this rule may hold a reviewer's repeated verdicts on one build: keep the latest.
DELETE FROM "build_reviews" a USING "build_reviews" b
  WHERE a."build_id" = b."build_id" AND a."reviewer_user_id" = b."reviewer_user_id"
    AND (a."created_at", a."id") < (b."created_at", b."id");--> statement-breakpoint
CREATE UNIQUE INDEX "build_reviews_build_reviewer_key" ON "build_reviews" USING btree ("build_id","reviewer_user_id");--> statement-breakpoint
CREATE INDEX "profiles_draft_saved_by_idx" ON "profiles" USING btree ("draft_saved_by_user_id");