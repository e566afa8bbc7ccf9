ALTER TABLE "interval_fits" ADD COLUMN "band" jsonb;--> statement-breakpoint
ALTER TABLE "interval_fits" ADD COLUMN "averages" double precision;--> statement-breakpoint
ALTER TABLE "interval_fits" ADD COLUMN "bin_correlation" double precision[];