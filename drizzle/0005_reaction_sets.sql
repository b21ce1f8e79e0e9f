CREATE TABLE "reaction_set_links" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"set_id" uuid NOT NULL,
	"selector_hash" text NOT NULL,
	"verifier_hash" text NOT NULL,
	"created_by_id" uuid,
	"created_by_name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"expires_at" timestamp with time zone,
	"revoked_at" timestamp with time zone,
	"last_used_at" timestamp with time zone,
	"emailed_to" text
);
--> statement-breakpoint
CREATE TABLE "reaction_set_versions" (
	"set_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"title" text NOT NULL,
	"description" text NOT NULL,
	"tags" jsonb NOT NULL,
	"items" jsonb NOT NULL,
	"pinned_revision" integer,
	"summary" text NOT NULL,
	"by_id" uuid,
	"by_name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "reaction_set_versions_set_id_version_pk" PRIMARY KEY("set_id","version")
);
--> statement-breakpoint
CREATE TABLE "reaction_sets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"title" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"tags" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"items" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"pinned_revision" integer,
	"version" integer DEFAULT 1 NOT NULL,
	"owner_id" uuid,
	"owner_name" text NOT NULL,
	"updated_by_id" uuid,
	"updated_by_name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "reaction_set_links" ADD CONSTRAINT "reaction_set_links_set_id_reaction_sets_id_fk" FOREIGN KEY ("set_id") REFERENCES "public"."reaction_sets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reaction_set_links" ADD CONSTRAINT "reaction_set_links_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reaction_set_versions" ADD CONSTRAINT "reaction_set_versions_set_id_reaction_sets_id_fk" FOREIGN KEY ("set_id") REFERENCES "public"."reaction_sets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reaction_set_versions" ADD CONSTRAINT "reaction_set_versions_by_id_users_id_fk" FOREIGN KEY ("by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reaction_sets" ADD CONSTRAINT "reaction_sets_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reaction_sets" ADD CONSTRAINT "reaction_sets_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reaction_sets" ADD CONSTRAINT "reaction_sets_updated_by_id_users_id_fk" FOREIGN KEY ("updated_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "reaction_set_links_selector_idx" ON "reaction_set_links" USING btree ("selector_hash");--> statement-breakpoint
CREATE INDEX "reaction_set_links_set_idx" ON "reaction_set_links" USING btree ("set_id");--> statement-breakpoint
CREATE INDEX "reaction_sets_team_idx" ON "reaction_sets" USING btree ("team_id","updated_at");