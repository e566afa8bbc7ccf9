CREATE TYPE "public"."run_state" AS ENUM('queued', 'running', 'finished', 'failed', 'cancelled');--> statement-breakpoint
CREATE TYPE "public"."surface_state" AS ENUM('queued', 'running', 'ready', 'failed');--> statement-breakpoint
CREATE TABLE "cavity_models" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"network_id" uuid NOT NULL,
	"lineage_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"name" text NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"config" jsonb NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "cavity_models_version_ck" CHECK ("cavity_models"."version" >= 1)
);
--> statement-breakpoint
CREATE TABLE "run_intervals" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"run_id" uuid NOT NULL,
	"starts_at" timestamp with time zone NOT NULL,
	"n_data" integer NOT NULL,
	"result" jsonb NOT NULL,
	"seconds" double precision NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "run_surfaces" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"run_id" uuid NOT NULL,
	"spec_key" text NOT NULL,
	"spec" jsonb NOT NULL,
	"state" "surface_state" DEFAULT 'queued' NOT NULL,
	"result" jsonb,
	"error" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"network_id" uuid NOT NULL,
	"name" text NOT NULL,
	"state" "run_state" DEFAULT 'queued' NOT NULL,
	"config" jsonb NOT NULL,
	"model_id" uuid NOT NULL,
	"grid_id" uuid NOT NULL,
	"engine_version" text NOT NULL,
	"interval_starts" jsonb NOT NULL,
	"progress" jsonb NOT NULL,
	"cancel_requested" boolean DEFAULT false NOT NULL,
	"error" text,
	"attempts" integer DEFAULT 0 NOT NULL,
	"worker_id" text,
	"heartbeat_at" timestamp with time zone,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "source_grids" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"network_id" uuid NOT NULL,
	"lineage_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"name" text NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"cell_size_deg" double precision NOT NULL,
	"regions" jsonb NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "source_grids_cell_ck" CHECK ("source_grids"."cell_size_deg" > 0 and "source_grids"."cell_size_deg" <= 30)
);
--> statement-breakpoint
ALTER TABLE "cavity_models" ADD CONSTRAINT "cavity_models_network_id_networks_id_fk" FOREIGN KEY ("network_id") REFERENCES "public"."networks"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cavity_models" ADD CONSTRAINT "cavity_models_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_intervals" ADD CONSTRAINT "run_intervals_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_surfaces" ADD CONSTRAINT "run_surfaces_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_network_id_networks_id_fk" FOREIGN KEY ("network_id") REFERENCES "public"."networks"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_model_id_cavity_models_id_fk" FOREIGN KEY ("model_id") REFERENCES "public"."cavity_models"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_grid_id_source_grids_id_fk" FOREIGN KEY ("grid_id") REFERENCES "public"."source_grids"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "source_grids" ADD CONSTRAINT "source_grids_network_id_networks_id_fk" FOREIGN KEY ("network_id") REFERENCES "public"."networks"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "source_grids" ADD CONSTRAINT "source_grids_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "cavity_models_lineage_version_uq" ON "cavity_models" USING btree ("lineage_id","version");--> statement-breakpoint
CREATE INDEX "cavity_models_network_idx" ON "cavity_models" USING btree ("network_id");--> statement-breakpoint
CREATE UNIQUE INDEX "run_intervals_run_start_uq" ON "run_intervals" USING btree ("run_id","starts_at");--> statement-breakpoint
CREATE UNIQUE INDEX "run_surfaces_run_spec_uq" ON "run_surfaces" USING btree ("run_id","spec_key");--> statement-breakpoint
CREATE INDEX "runs_network_created_idx" ON "runs" USING btree ("network_id","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "source_grids_lineage_version_uq" ON "source_grids" USING btree ("lineage_id","version");--> statement-breakpoint
CREATE INDEX "source_grids_network_idx" ON "source_grids" USING btree ("network_id");