ALTER TABLE "library_revisions" DROP CONSTRAINT "library_revisions_created_by_users_id_fk";
--> statement-breakpoint
ALTER TABLE "library_selections" DROP CONSTRAINT "library_selections_selected_by_users_id_fk";
