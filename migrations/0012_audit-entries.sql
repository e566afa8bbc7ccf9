CREATE TYPE "public"."audit_action" AS ENUM('created', 'changed', 'shared', 'exported', 'imported', 'deleted');--> statement-breakpoint
CREATE TABLE "audit_entries" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"network_id" uuid NOT NULL,
	"action" "audit_action" NOT NULL,
	"subject_kind" text NOT NULL,
	"subject_id" text,
	"actor_id" text,
	"actor_label" text NOT NULL,
	"summary" text NOT NULL
);
--> statement-breakpoint
ALTER TABLE "audit_entries" ADD CONSTRAINT "audit_entries_network_id_networks_id_fk" FOREIGN KEY ("network_id") REFERENCES "public"."networks"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_entries" ADD CONSTRAINT "audit_entries_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "audit_entries_network_idx" ON "audit_entries" USING btree ("network_id","at");