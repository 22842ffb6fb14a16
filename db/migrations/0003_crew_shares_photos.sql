CREATE TABLE "setup_photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"setup_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"uploaded_by" text,
	"filename" text NOT NULL,
	"mime" text NOT NULL,
	"bytes" integer NOT NULL,
	"width" integer,
	"height" integer,
	"object_key" text NOT NULL,
	"thumb_key" text,
	"iso" real,
	"aperture" real,
	"shutter_s" real,
	"focal_mm" real,
	"camera" text,
	"taken_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "setup_shares" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"setup_id" uuid NOT NULL,
	"token_hash" text NOT NULL,
	"token_tail" text NOT NULL,
	"label" text DEFAULT '' NOT NULL,
	"units" text DEFAULT 'metric' NOT NULL,
	"paper" text DEFAULT 'a4' NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_opened_at" timestamp with time zone,
	"revoked_at" timestamp with time zone,
	CONSTRAINT "setup_shares_token_hash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
ALTER TABLE "setup_photos" ADD CONSTRAINT "setup_photos_setup_id_setups_id_fk" FOREIGN KEY ("setup_id") REFERENCES "public"."setups"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "setup_photos" ADD CONSTRAINT "setup_photos_uploaded_by_user_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "setup_shares" ADD CONSTRAINT "setup_shares_setup_id_setups_id_fk" FOREIGN KEY ("setup_id") REFERENCES "public"."setups"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "setup_shares" ADD CONSTRAINT "setup_shares_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "setup_photos_setup_idx" ON "setup_photos" USING btree ("setup_id","created_at");--> statement-breakpoint
CREATE INDEX "setup_shares_setup_idx" ON "setup_shares" USING btree ("setup_id","created_at");