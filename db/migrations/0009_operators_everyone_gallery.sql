CREATE TABLE "operators" (
	"user_id" text PRIMARY KEY NOT NULL,
	"added_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
DROP INDEX "setups_template_updated_idx";--> statement-breakpoint
ALTER TABLE "setups" ADD COLUMN "for_everyone" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "operators" ADD CONSTRAINT "operators_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "setups_everyone_updated_idx" ON "setups" USING btree ("updated_at" DESC NULLS LAST,"id" DESC NULLS LAST) WHERE "setups"."for_everyone" and "setups"."deleted_at" is null;