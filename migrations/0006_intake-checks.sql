ALTER TABLE "intervals" ADD COLUMN "samples_sha256" text;--> statement-breakpoint
ALTER TABLE "uploads" ADD COLUMN "warnings" jsonb DEFAULT '[]'::jsonb NOT NULL;