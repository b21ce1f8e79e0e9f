CREATE TABLE "calorimetry_runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"author_id" uuid,
	"author_name" text NOT NULL,
	"kind" text NOT NULL,
	"label" text NOT NULL,
	"note" text,
	"inputs" jsonb NOT NULL,
	"evidence" jsonb,
	"result" jsonb NOT NULL,
	"library_revision" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "calorimetry_runs" ADD CONSTRAINT "calorimetry_runs_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "calorimetry_runs" ADD CONSTRAINT "calorimetry_runs_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "calorimetry_runs_team_idx" ON "calorimetry_runs" USING btree ("team_id","updated_at");