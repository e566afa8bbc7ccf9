CREATE TABLE "run_comments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"network_id" uuid NOT NULL,
	"run_id" uuid NOT NULL,
	"interval_starts_at" timestamp with time zone,
	"minimum" integer,
	"author_id" text,
	"body" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "run_comments_target_ck" CHECK (("run_comments"."interval_starts_at" is null) = ("run_comments"."minimum" is null)),
	CONSTRAINT "run_comments_minimum_ck" CHECK ("run_comments"."minimum" is null or "run_comments"."minimum" >= 0)
);
--> statement-breakpoint
ALTER TABLE "run_comments" ADD CONSTRAINT "run_comments_network_id_networks_id_fk" FOREIGN KEY ("network_id") REFERENCES "public"."networks"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_comments" ADD CONSTRAINT "run_comments_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_comments" ADD CONSTRAINT "run_comments_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "run_comments_run_idx" ON "run_comments" USING btree ("run_id","created_at");