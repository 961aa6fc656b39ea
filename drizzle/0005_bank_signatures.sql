CREATE TABLE "bank_signing_keys" (
	"board_model_id" uuid NOT NULL,
	"key_id" text NOT NULL,
	"public_key_pem" text NOT NULL,
	"valid_from" timestamp with time zone DEFAULT now() NOT NULL,
	"valid_until" timestamp with time zone,
	CONSTRAINT "bank_signing_keys_board_model_id_key_id_pk" PRIMARY KEY("board_model_id","key_id"),
	CONSTRAINT "bank_signing_keys_key_id_hex" CHECK ("bank_signing_keys"."key_id" ~ '^[0-9a-f]{16}$')
);
--> statement-breakpoint
ALTER TABLE "builds" ADD COLUMN "bank_signature" "bytea";--> statement-breakpoint
ALTER TABLE "builds" ADD COLUMN "bank_signature_key_id" text;--> statement-breakpoint
ALTER TABLE "bank_signing_keys" ADD CONSTRAINT "bank_signing_keys_board_model_id_board_models_id_fk" FOREIGN KEY ("board_model_id") REFERENCES "public"."board_models"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "bank_signing_keys_board_idx" ON "bank_signing_keys" USING btree ("board_model_id");--> statement-breakpoint
ALTER TABLE "builds" ADD CONSTRAINT "builds_signature_has_key" CHECK (("builds"."bank_signature" is null) = ("builds"."bank_signature_key_id" is null));