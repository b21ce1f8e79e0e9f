CREATE TABLE "library_models" (
	"row_id" bigserial PRIMARY KEY NOT NULL,
	"id" uuid NOT NULL,
	"species_id" uuid NOT NULL,
	"source_id" uuid NOT NULL,
	"scale" text NOT NULL,
	"forms" jsonb NOT NULL,
	"t_min" double precision NOT NULL,
	"t_max" double precision NOT NULL,
	"entry_note" text,
	"provenance" text NOT NULL,
	"provenance_note" text,
	"valid_from" integer NOT NULL,
	"valid_to" integer
);
--> statement-breakpoint
CREATE TABLE "library_reactions" (
	"row_id" bigserial PRIMARY KEY NOT NULL,
	"id" uuid NOT NULL,
	"key" text NOT NULL,
	"equation" text NOT NULL,
	"terms" jsonb NOT NULL,
	"delta_h" numeric NOT NULL,
	"uncertainty_kind" text NOT NULL,
	"uncertainty_stated" numeric,
	"coverage_k" double precision,
	"standard_uncertainty" double precision,
	"uncertainty_rule" text NOT NULL,
	"temperature" double precision NOT NULL,
	"method" text NOT NULL,
	"molality" double precision,
	"source_id" uuid NOT NULL,
	"table_ref" text,
	"independent" boolean DEFAULT true NOT NULL,
	"provenance" text NOT NULL,
	"provenance_note" text,
	"valid_from" integer NOT NULL,
	"valid_to" integer
);
--> statement-breakpoint
CREATE TABLE "library_revisions" (
	"number" integer PRIMARY KEY NOT NULL,
	"kind" text NOT NULL,
	"summary" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"created_by" uuid,
	"created_by_email" text,
	"amendment_id" uuid,
	"detail" jsonb DEFAULT '{}'::jsonb NOT NULL
);
--> statement-breakpoint
CREATE TABLE "library_selections" (
	"row_id" bigserial PRIMARY KEY NOT NULL,
	"species_id" uuid NOT NULL,
	"property" text NOT NULL,
	"value_id" uuid NOT NULL,
	"reason" text NOT NULL,
	"selected_by" uuid,
	"valid_from" integer NOT NULL,
	"valid_to" integer
);
--> statement-breakpoint
CREATE TABLE "library_sources" (
	"row_id" bigserial PRIMARY KEY NOT NULL,
	"id" uuid NOT NULL,
	"key" text NOT NULL,
	"kind" text NOT NULL,
	"authors" text NOT NULL,
	"title" text NOT NULL,
	"publication" text,
	"year" integer,
	"volume" text,
	"pages" text,
	"doi" text,
	"isbn" text,
	"url" text,
	"note" text,
	"valid_from" integer NOT NULL,
	"valid_to" integer
);
--> statement-breakpoint
CREATE TABLE "library_species" (
	"row_id" bigserial PRIMARY KEY NOT NULL,
	"id" uuid NOT NULL,
	"key" text NOT NULL,
	"formula" text NOT NULL,
	"hill" text NOT NULL,
	"charge" integer NOT NULL,
	"phase" text NOT NULL,
	"descriptor" text,
	"name" text NOT NULL,
	"synonyms" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"cas" text,
	"inchi" text,
	"inchikey" text,
	"reference_state" text,
	"molar_mass" double precision NOT NULL,
	"note" text,
	"valid_from" integer NOT NULL,
	"valid_to" integer
);
--> statement-breakpoint
CREATE TABLE "library_values" (
	"row_id" bigserial PRIMARY KEY NOT NULL,
	"id" uuid NOT NULL,
	"species_id" uuid NOT NULL,
	"property" text NOT NULL,
	"value" numeric NOT NULL,
	"uncertainty_kind" text NOT NULL,
	"uncertainty_stated" numeric,
	"coverage_k" double precision,
	"standard_uncertainty" double precision,
	"uncertainty_rule" text NOT NULL,
	"source_id" uuid NOT NULL,
	"table_ref" text,
	"entry_note" text,
	"provenance" text NOT NULL,
	"provenance_note" text,
	"pressure_bar" double precision DEFAULT 1 NOT NULL,
	"ion_convention" text,
	"derivation" jsonb,
	"valid_from" integer NOT NULL,
	"valid_to" integer
);
--> statement-breakpoint
CREATE TABLE "team_derived_values" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"species_key" text NOT NULL,
	"formula" text NOT NULL,
	"hill" text NOT NULL,
	"charge" integer NOT NULL,
	"phase" text NOT NULL,
	"descriptor" text,
	"library_species_id" uuid,
	"delta_h" numeric NOT NULL,
	"uncertainty" double precision,
	"uncertainty_missing" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"derivation" jsonb NOT NULL,
	"library_revision" integer NOT NULL,
	"note" text,
	"created_by" uuid,
	"created_by_name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "library_models" ADD CONSTRAINT "library_models_valid_from_library_revisions_number_fk" FOREIGN KEY ("valid_from") REFERENCES "public"."library_revisions"("number") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "library_models" ADD CONSTRAINT "library_models_valid_to_library_revisions_number_fk" FOREIGN KEY ("valid_to") REFERENCES "public"."library_revisions"("number") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "library_reactions" ADD CONSTRAINT "library_reactions_valid_from_library_revisions_number_fk" FOREIGN KEY ("valid_from") REFERENCES "public"."library_revisions"("number") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "library_reactions" ADD CONSTRAINT "library_reactions_valid_to_library_revisions_number_fk" FOREIGN KEY ("valid_to") REFERENCES "public"."library_revisions"("number") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "library_revisions" ADD CONSTRAINT "library_revisions_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "library_selections" ADD CONSTRAINT "library_selections_selected_by_users_id_fk" FOREIGN KEY ("selected_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "library_selections" ADD CONSTRAINT "library_selections_valid_from_library_revisions_number_fk" FOREIGN KEY ("valid_from") REFERENCES "public"."library_revisions"("number") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "library_selections" ADD CONSTRAINT "library_selections_valid_to_library_revisions_number_fk" FOREIGN KEY ("valid_to") REFERENCES "public"."library_revisions"("number") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "library_sources" ADD CONSTRAINT "library_sources_valid_from_library_revisions_number_fk" FOREIGN KEY ("valid_from") REFERENCES "public"."library_revisions"("number") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "library_sources" ADD CONSTRAINT "library_sources_valid_to_library_revisions_number_fk" FOREIGN KEY ("valid_to") REFERENCES "public"."library_revisions"("number") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "library_species" ADD CONSTRAINT "library_species_valid_from_library_revisions_number_fk" FOREIGN KEY ("valid_from") REFERENCES "public"."library_revisions"("number") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "library_species" ADD CONSTRAINT "library_species_valid_to_library_revisions_number_fk" FOREIGN KEY ("valid_to") REFERENCES "public"."library_revisions"("number") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "library_values" ADD CONSTRAINT "library_values_valid_from_library_revisions_number_fk" FOREIGN KEY ("valid_from") REFERENCES "public"."library_revisions"("number") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "library_values" ADD CONSTRAINT "library_values_valid_to_library_revisions_number_fk" FOREIGN KEY ("valid_to") REFERENCES "public"."library_revisions"("number") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "team_derived_values" ADD CONSTRAINT "team_derived_values_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "team_derived_values" ADD CONSTRAINT "team_derived_values_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "library_models_current_id" ON "library_models" USING btree ("id") WHERE "library_models"."valid_to" is null;--> statement-breakpoint
CREATE INDEX "library_models_species" ON "library_models" USING btree ("species_id");--> statement-breakpoint
CREATE INDEX "library_models_validity" ON "library_models" USING btree ("valid_from","valid_to");--> statement-breakpoint
CREATE UNIQUE INDEX "library_reactions_current_id" ON "library_reactions" USING btree ("id") WHERE "library_reactions"."valid_to" is null;--> statement-breakpoint
CREATE UNIQUE INDEX "library_reactions_current_key" ON "library_reactions" USING btree ("key") WHERE "library_reactions"."valid_to" is null;--> statement-breakpoint
CREATE INDEX "library_reactions_validity" ON "library_reactions" USING btree ("valid_from","valid_to");--> statement-breakpoint
CREATE UNIQUE INDEX "library_selections_current" ON "library_selections" USING btree ("species_id","property") WHERE "library_selections"."valid_to" is null;--> statement-breakpoint
CREATE INDEX "library_selections_validity" ON "library_selections" USING btree ("valid_from","valid_to");--> statement-breakpoint
CREATE UNIQUE INDEX "library_sources_current_id" ON "library_sources" USING btree ("id") WHERE "library_sources"."valid_to" is null;--> statement-breakpoint
CREATE UNIQUE INDEX "library_sources_current_key" ON "library_sources" USING btree ("key") WHERE "library_sources"."valid_to" is null;--> statement-breakpoint
CREATE INDEX "library_sources_validity" ON "library_sources" USING btree ("valid_from","valid_to");--> statement-breakpoint
CREATE UNIQUE INDEX "library_species_current_id" ON "library_species" USING btree ("id") WHERE "library_species"."valid_to" is null;--> statement-breakpoint
CREATE UNIQUE INDEX "library_species_current_key" ON "library_species" USING btree ("key") WHERE "library_species"."valid_to" is null;--> statement-breakpoint
CREATE INDEX "library_species_validity" ON "library_species" USING btree ("valid_from","valid_to");--> statement-breakpoint
CREATE INDEX "library_species_hill" ON "library_species" USING btree ("hill");--> statement-breakpoint
CREATE UNIQUE INDEX "library_values_current_id" ON "library_values" USING btree ("id") WHERE "library_values"."valid_to" is null;--> statement-breakpoint
CREATE INDEX "library_values_species" ON "library_values" USING btree ("species_id");--> statement-breakpoint
CREATE INDEX "library_values_validity" ON "library_values" USING btree ("valid_from","valid_to");--> statement-breakpoint
CREATE INDEX "team_derived_values_team" ON "team_derived_values" USING btree ("team_id","species_key");