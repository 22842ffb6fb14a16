CREATE TABLE "studio_invitations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"studio_id" uuid NOT NULL,
	"email" text NOT NULL,
	"role" "studio_role" NOT NULL,
	"token_hash" text NOT NULL,
	"invited_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"accepted_at" timestamp with time zone,
	"accepted_by" text,
	"revoked_at" timestamp with time zone,
	"delivery" text DEFAULT 'link' NOT NULL,
	"sent_at" timestamp with time zone,
	"delivery_error" text,
	CONSTRAINT "studio_invitations_token_hash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
CREATE TABLE "setup_comments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"setup_id" uuid NOT NULL,
	"author_id" text,
	"body" text NOT NULL,
	"item_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "setup_versions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"setup_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"title" text NOT NULL,
	"notes" text NOT NULL,
	"tags" text[] NOT NULL,
	"document" jsonb NOT NULL,
	"schema_version" integer NOT NULL,
	"item_count" integer NOT NULL,
	"saved_by" text,
	"saved_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "setup_versions_setup_version_uq" UNIQUE("setup_id","version")
);
--> statement-breakpoint
DROP INDEX "setups_template_idx";--> statement-breakpoint
DROP INDEX "setups_studio_updated_idx";--> statement-breakpoint
ALTER TABLE "setups" ADD COLUMN "item_count" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "studio_invitations" ADD CONSTRAINT "studio_invitations_studio_id_studios_id_fk" FOREIGN KEY ("studio_id") REFERENCES "public"."studios"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "studio_invitations" ADD CONSTRAINT "studio_invitations_invited_by_user_id_fk" FOREIGN KEY ("invited_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "studio_invitations" ADD CONSTRAINT "studio_invitations_accepted_by_user_id_fk" FOREIGN KEY ("accepted_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "setup_comments" ADD CONSTRAINT "setup_comments_setup_id_setups_id_fk" FOREIGN KEY ("setup_id") REFERENCES "public"."setups"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "setup_comments" ADD CONSTRAINT "setup_comments_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "setup_versions" ADD CONSTRAINT "setup_versions_setup_id_setups_id_fk" FOREIGN KEY ("setup_id") REFERENCES "public"."setups"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "setup_versions" ADD CONSTRAINT "setup_versions_saved_by_user_id_fk" FOREIGN KEY ("saved_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "studio_invitations_open_uq" ON "studio_invitations" USING btree ("studio_id",lower("email")) WHERE "studio_invitations"."accepted_at" is null and "studio_invitations"."revoked_at" is null;--> statement-breakpoint
CREATE INDEX "setup_comments_setup_idx" ON "setup_comments" USING btree ("setup_id","created_at","id");--> statement-breakpoint
CREATE INDEX "setups_studio_created_idx" ON "setups" USING btree ("studio_id","created_at" DESC NULLS LAST,"id" DESC NULLS LAST) WHERE "setups"."deleted_at" is null;--> statement-breakpoint
CREATE INDEX "setups_studio_title_idx" ON "setups" USING btree ("studio_id",lower("title"),"id") WHERE "setups"."deleted_at" is null;--> statement-breakpoint
CREATE INDEX "setups_studio_deleted_idx" ON "setups" USING btree ("studio_id","deleted_at" DESC NULLS LAST) WHERE "setups"."deleted_at" is not null;--> statement-breakpoint
CREATE INDEX "setups_template_updated_idx" ON "setups" USING btree ("updated_at" DESC NULLS LAST,"id" DESC NULLS LAST) WHERE "setups"."is_template" and "setups"."deleted_at" is null;--> statement-breakpoint
CREATE INDEX "setups_title_trgm_idx" ON "setups" USING gin ("title" gin_trgm_ops);--> statement-breakpoint
CREATE INDEX "setups_notes_trgm_idx" ON "setups" USING gin ("notes" gin_trgm_ops);--> statement-breakpoint
CREATE INDEX "setups_studio_updated_idx" ON "setups" USING btree ("studio_id","updated_at" DESC NULLS LAST,"id" DESC NULLS LAST) WHERE "setups"."deleted_at" is null;--> statement-breakpoint
-- Backfill: the item count of existing setups, and their current state as the first history row.
UPDATE "setups" SET "item_count" = coalesce(jsonb_array_length("document"->'items'), 0);--> statement-breakpoint
INSERT INTO "setup_versions" ("setup_id", "version", "title", "notes", "tags", "document", "schema_version", "item_count", "saved_by", "saved_at")
SELECT "id", "version", "title", "notes", "tags", "document", "schema_version", "item_count", "owner_id", "updated_at" FROM "setups";
