CREATE TABLE "setup_reads" (
	"user_id" text NOT NULL,
	"setup_id" uuid NOT NULL,
	"last_read_at" timestamp with time zone,
	"notified_at" timestamp with time zone,
	CONSTRAINT "setup_reads_user_id_setup_id_pk" PRIMARY KEY("user_id","setup_id")
);
--> statement-breakpoint
ALTER TABLE "setup_comments" ADD COLUMN "x_m" real;--> statement-breakpoint
ALTER TABLE "setup_comments" ADD COLUMN "y_m" real;--> statement-breakpoint
ALTER TABLE "setup_comments" ADD COLUMN "parent_id" uuid;--> statement-breakpoint
ALTER TABLE "setup_comments" ADD COLUMN "resolved_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "setup_comments" ADD COLUMN "resolved_by" text;--> statement-breakpoint
ALTER TABLE "setup_reads" ADD CONSTRAINT "setup_reads_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "setup_reads" ADD CONSTRAINT "setup_reads_setup_id_setups_id_fk" FOREIGN KEY ("setup_id") REFERENCES "public"."setups"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "setup_comments" ADD CONSTRAINT "setup_comments_parent_id_setup_comments_id_fk" FOREIGN KEY ("parent_id") REFERENCES "public"."setup_comments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "setup_comments" ADD CONSTRAINT "setup_comments_resolved_by_user_id_fk" FOREIGN KEY ("resolved_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;