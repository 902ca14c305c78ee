ALTER TABLE "design_revisions" ALTER COLUMN "choice" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "design_revisions" ADD COLUMN "plan" jsonb;--> statement-breakpoint
ALTER TABLE "design_revisions" ADD CONSTRAINT "design_revisions_choice_or_plan" CHECK (("design_revisions"."choice" is null) <> ("design_revisions"."plan" is null));