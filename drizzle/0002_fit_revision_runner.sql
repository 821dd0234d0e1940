ALTER TABLE "fit_revision" ADD COLUMN "runner" text;--> statement-breakpoint
ALTER TABLE "fit_revision" ADD COLUMN "launch_warnings" jsonb DEFAULT '[]'::jsonb NOT NULL;