CREATE TABLE "amendment_comments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"amendment_id" uuid NOT NULL,
	"author_id" uuid,
	"author_name" text NOT NULL,
	"body" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "amendment_entries" (
	"amendment_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"kind" text NOT NULL,
	"payload" jsonb NOT NULL,
	"species_key" text,
	"species_id" uuid,
	CONSTRAINT "amendment_entries_amendment_id_position_pk" PRIMARY KEY("amendment_id","position")
);
--> statement-breakpoint
CREATE TABLE "amendment_events" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"amendment_id" uuid NOT NULL,
	"action" text NOT NULL,
	"from_state" text,
	"to_state" text NOT NULL,
	"actor_id" uuid,
	"actor_name" text,
	"reason" text,
	"detail" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "amendment_files" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"amendment_id" uuid NOT NULL,
	"stored_name" text NOT NULL,
	"original_name" text NOT NULL,
	"media_type" text NOT NULL,
	"size" integer NOT NULL,
	"sha256" text NOT NULL,
	"uploaded_by" uuid,
	"uploaded_by_name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "amendment_files_stored_name_unique" UNIQUE("stored_name")
);
--> statement-breakpoint
CREATE TABLE "amendments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"title" text NOT NULL,
	"rationale" text NOT NULL,
	"state" text NOT NULL,
	"author_id" uuid,
	"author_name" text NOT NULL,
	"base_revision" integer NOT NULL,
	"result_revision" integer,
	"revert_of" uuid,
	"origin" jsonb DEFAULT '{"kind":"editor"}'::jsonb NOT NULL,
	"diff" jsonb NOT NULL,
	"targets" jsonb NOT NULL,
	"entry_count" integer NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"opened_at" timestamp with time zone,
	"closed_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "digest_items" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"user_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"line" text NOT NULL,
	"link" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"sent_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "notification_settings" (
	"user_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"mode" text NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "notification_settings_user_id_kind_pk" PRIMARY KEY("user_id","kind")
);
--> statement-breakpoint
ALTER TABLE "library_revisions" ADD COLUMN "touched" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "amendment_comments" ADD CONSTRAINT "amendment_comments_amendment_id_amendments_id_fk" FOREIGN KEY ("amendment_id") REFERENCES "public"."amendments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "amendment_comments" ADD CONSTRAINT "amendment_comments_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "amendment_entries" ADD CONSTRAINT "amendment_entries_amendment_id_amendments_id_fk" FOREIGN KEY ("amendment_id") REFERENCES "public"."amendments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "amendment_events" ADD CONSTRAINT "amendment_events_amendment_id_amendments_id_fk" FOREIGN KEY ("amendment_id") REFERENCES "public"."amendments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "amendment_events" ADD CONSTRAINT "amendment_events_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "amendment_files" ADD CONSTRAINT "amendment_files_amendment_id_amendments_id_fk" FOREIGN KEY ("amendment_id") REFERENCES "public"."amendments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "amendment_files" ADD CONSTRAINT "amendment_files_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "amendments" ADD CONSTRAINT "amendments_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "amendments" ADD CONSTRAINT "amendments_base_revision_library_revisions_number_fk" FOREIGN KEY ("base_revision") REFERENCES "public"."library_revisions"("number") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "amendments" ADD CONSTRAINT "amendments_result_revision_library_revisions_number_fk" FOREIGN KEY ("result_revision") REFERENCES "public"."library_revisions"("number") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "amendments" ADD CONSTRAINT "amendments_revert_of_amendments_id_fk" FOREIGN KEY ("revert_of") REFERENCES "public"."amendments"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "digest_items" ADD CONSTRAINT "digest_items_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notification_settings" ADD CONSTRAINT "notification_settings_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "amendment_comments_amendment" ON "amendment_comments" USING btree ("amendment_id","created_at");--> statement-breakpoint
CREATE INDEX "amendment_entries_species_key" ON "amendment_entries" USING btree ("species_key");--> statement-breakpoint
CREATE INDEX "amendment_entries_species_id" ON "amendment_entries" USING btree ("species_id");--> statement-breakpoint
CREATE INDEX "amendment_events_amendment" ON "amendment_events" USING btree ("amendment_id","id");--> statement-breakpoint
CREATE INDEX "amendment_files_amendment" ON "amendment_files" USING btree ("amendment_id","created_at");--> statement-breakpoint
CREATE INDEX "amendments_state" ON "amendments" USING btree ("state","updated_at");--> statement-breakpoint
CREATE INDEX "amendments_author" ON "amendments" USING btree ("author_id");--> statement-breakpoint
CREATE INDEX "amendments_revert_of" ON "amendments" USING btree ("revert_of");--> statement-breakpoint
CREATE INDEX "digest_items_pending" ON "digest_items" USING btree ("user_id","sent_at");