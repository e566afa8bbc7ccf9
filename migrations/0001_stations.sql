CREATE TYPE "public"."interval_origin" AS ENUM('upload', 'push', 'synthetic');--> statement-breakpoint
CREATE TYPE "public"."station_component" AS ENUM('Ez', 'Bns', 'Bew');--> statement-breakpoint
CREATE TYPE "public"."station_status" AS ENUM('operating', 'paused', 'retired');--> statement-breakpoint
CREATE TYPE "public"."upload_format" AS ENUM('series-csv', 'spectra-csv', 'series-json');--> statement-breakpoint
CREATE TYPE "public"."upload_state" AS ENUM('queued', 'processing', 'done', 'failed');--> statement-breakpoint
CREATE TABLE "interval_fits" (
	"interval_id" uuid PRIMARY KEY NOT NULL,
	"modes" jsonb NOT NULL,
	"background" jsonb NOT NULL,
	"misfit" double precision NOT NULL
);
--> statement-breakpoint
CREATE TABLE "interval_spectra" (
	"interval_id" uuid PRIMARY KEY NOT NULL,
	"frequencies" double precision[] NOT NULL,
	"power" double precision[] NOT NULL,
	"segments" integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE "intervals" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"network_id" uuid NOT NULL,
	"station_id" uuid NOT NULL,
	"component" "station_component" NOT NULL,
	"starts_at" timestamp with time zone NOT NULL,
	"duration_s" integer DEFAULT 600 NOT NULL,
	"origin" interval_origin NOT NULL,
	"upload_id" uuid,
	"rejected_share" real DEFAULT 0 NOT NULL,
	"quality_flags" text[] DEFAULT '{}'::text[] NOT NULL,
	"flag_reason" text,
	"flagged_by" text,
	"flagged_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "push_tokens" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"network_id" uuid NOT NULL,
	"station_id" uuid NOT NULL,
	"label" text NOT NULL,
	"secret_hash" text NOT NULL,
	"hint" text NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"expires_at" timestamp with time zone,
	"revoked_at" timestamp with time zone,
	"last_used_at" timestamp with time zone,
	"window_started_at" timestamp with time zone DEFAULT now() NOT NULL,
	"window_count" integer DEFAULT 0 NOT NULL
);
--> statement-breakpoint
CREATE TABLE "station_components" (
	"station_id" uuid NOT NULL,
	"component" "station_component" NOT NULL,
	"calibration" jsonb NOT NULL,
	CONSTRAINT "station_components_station_id_component_pk" PRIMARY KEY("station_id","component")
);
--> statement-breakpoint
CREATE TABLE "stations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"network_id" uuid NOT NULL,
	"code" text NOT NULL,
	"name" text NOT NULL,
	"latitude" double precision NOT NULL,
	"longitude" double precision NOT NULL,
	"elevation_m" double precision,
	"mains_hz" integer DEFAULT 50 NOT NULL,
	"interference_lines" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"sample_rate_hz" double precision NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"status" "station_status" DEFAULT 'operating' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "stations_lat_ck" CHECK ("stations"."latitude" between -90 and 90),
	CONSTRAINT "stations_lon_ck" CHECK ("stations"."longitude" between -180 and 180),
	CONSTRAINT "stations_mains_ck" CHECK ("stations"."mains_hz" in (50, 60)),
	CONSTRAINT "stations_rate_ck" CHECK ("stations"."sample_rate_hz" > 0)
);
--> statement-breakpoint
CREATE TABLE "upload_chunks" (
	"upload_id" uuid NOT NULL,
	"seq" integer NOT NULL,
	"data" "bytea" NOT NULL,
	CONSTRAINT "upload_chunks_upload_id_seq_pk" PRIMARY KEY("upload_id","seq")
);
--> statement-breakpoint
CREATE TABLE "uploads" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"network_id" uuid NOT NULL,
	"station_id" uuid NOT NULL,
	"uploaded_by" text,
	"file_name" text NOT NULL,
	"format" "upload_format" NOT NULL,
	"size_bytes" bigint NOT NULL,
	"sha256" text NOT NULL,
	"state" "upload_state" DEFAULT 'queued' NOT NULL,
	"progress" real DEFAULT 0 NOT NULL,
	"progress_note" text DEFAULT '' NOT NULL,
	"error" text,
	"attempts" integer DEFAULT 0 NOT NULL,
	"interval_count" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "interval_fits" ADD CONSTRAINT "interval_fits_interval_id_intervals_id_fk" FOREIGN KEY ("interval_id") REFERENCES "public"."intervals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "interval_spectra" ADD CONSTRAINT "interval_spectra_interval_id_intervals_id_fk" FOREIGN KEY ("interval_id") REFERENCES "public"."intervals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intervals" ADD CONSTRAINT "intervals_network_id_networks_id_fk" FOREIGN KEY ("network_id") REFERENCES "public"."networks"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intervals" ADD CONSTRAINT "intervals_station_id_stations_id_fk" FOREIGN KEY ("station_id") REFERENCES "public"."stations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intervals" ADD CONSTRAINT "intervals_upload_id_uploads_id_fk" FOREIGN KEY ("upload_id") REFERENCES "public"."uploads"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intervals" ADD CONSTRAINT "intervals_flagged_by_users_id_fk" FOREIGN KEY ("flagged_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "push_tokens" ADD CONSTRAINT "push_tokens_network_id_networks_id_fk" FOREIGN KEY ("network_id") REFERENCES "public"."networks"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "push_tokens" ADD CONSTRAINT "push_tokens_station_id_stations_id_fk" FOREIGN KEY ("station_id") REFERENCES "public"."stations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "push_tokens" ADD CONSTRAINT "push_tokens_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "station_components" ADD CONSTRAINT "station_components_station_id_stations_id_fk" FOREIGN KEY ("station_id") REFERENCES "public"."stations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stations" ADD CONSTRAINT "stations_network_id_networks_id_fk" FOREIGN KEY ("network_id") REFERENCES "public"."networks"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "upload_chunks" ADD CONSTRAINT "upload_chunks_upload_id_uploads_id_fk" FOREIGN KEY ("upload_id") REFERENCES "public"."uploads"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_network_id_networks_id_fk" FOREIGN KEY ("network_id") REFERENCES "public"."networks"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_station_id_stations_id_fk" FOREIGN KEY ("station_id") REFERENCES "public"."stations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "intervals_station_component_start_uq" ON "intervals" USING btree ("station_id","component","starts_at");--> statement-breakpoint
CREATE INDEX "intervals_network_start_idx" ON "intervals" USING btree ("network_id","starts_at");--> statement-breakpoint
CREATE UNIQUE INDEX "push_tokens_secret_uq" ON "push_tokens" USING btree ("secret_hash");--> statement-breakpoint
CREATE UNIQUE INDEX "stations_network_code_uq" ON "stations" USING btree ("network_id","code");--> statement-breakpoint
CREATE UNIQUE INDEX "uploads_network_sha_uq" ON "uploads" USING btree ("network_id","sha256");--> statement-breakpoint
CREATE INDEX "uploads_station_idx" ON "uploads" USING btree ("station_id","created_at");