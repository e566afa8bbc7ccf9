CREATE TABLE "run_chunks" (
	"first_index" integer NOT NULL,
	"count" integer NOT NULL,
	"run_id" uuid NOT NULL,
	"worker_id" text,
	"heartbeat_at" timestamp with time zone,
	"attempts" integer DEFAULT 0 NOT NULL,
	"done_at" timestamp with time zone,
	CONSTRAINT "run_chunks_run_id_first_index_pk" PRIMARY KEY("run_id","first_index"),
	CONSTRAINT "run_chunks_range_ck" CHECK ("run_chunks"."first_index" >= 0 and "run_chunks"."count" >= 1)
);
--> statement-breakpoint
ALTER TABLE "run_chunks" ADD CONSTRAINT "run_chunks_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;