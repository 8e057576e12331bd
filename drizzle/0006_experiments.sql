CREATE TYPE "public"."experiment_row_status" AS ENUM('ok', 'error', 'limit', 'cancelled');--> statement-breakpoint
CREATE TYPE "public"."experiment_status" AS ENUM('queued', 'running', 'paused', 'done', 'cancelled');--> statement-breakpoint
CREATE TYPE "public"."upload_format" AS ENUM('text', 'json');--> statement-breakpoint
CREATE TABLE "experiment_rows" (
	"experiment_id" uuid NOT NULL,
	"member_index" integer NOT NULL,
	"status" "experiment_row_status" NOT NULL,
	"fields" jsonb NOT NULL,
	"message" text,
	"duration_ms" integer NOT NULL,
	"worker" text NOT NULL,
	"finished_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "experiment_rows_experiment_id_member_index_pk" PRIMARY KEY("experiment_id","member_index"),
	CONSTRAINT "experiment_rows_index_nonnegative" CHECK ("experiment_rows"."member_index" >= 0),
	CONSTRAINT "experiment_rows_duration_nonnegative" CHECK ("experiment_rows"."duration_ms" >= 0)
);
--> statement-breakpoint
CREATE TABLE "experiments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"session_id" uuid NOT NULL,
	"created_by" uuid,
	"title" text NOT NULL,
	"status" "experiment_status" DEFAULT 'queued' NOT NULL,
	"program" text NOT NULL,
	"family_definition" text NOT NULL,
	"family" jsonb NOT NULL,
	"labels" jsonb NOT NULL,
	"probe_text" text NOT NULL,
	"probe" jsonb NOT NULL,
	"engine_version" text NOT NULL,
	"limits" jsonb NOT NULL,
	"total" integer NOT NULL,
	"columns" jsonb,
	"source_cell_id" uuid,
	"upload_id" uuid,
	"rerun_of" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone,
	CONSTRAINT "experiments_total_nonnegative" CHECK ("experiments"."total" >= 0)
);
--> statement-breakpoint
CREATE TABLE "uploads" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"session_id" uuid NOT NULL,
	"created_by" uuid,
	"name" text NOT NULL,
	"format" "upload_format" NOT NULL,
	"content" text NOT NULL,
	"family" jsonb NOT NULL,
	"length" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "experiment_rows" ADD CONSTRAINT "experiment_rows_experiment_id_experiments_id_fk" FOREIGN KEY ("experiment_id") REFERENCES "public"."experiments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "experiments" ADD CONSTRAINT "experiments_session_id_sessions_id_fk" FOREIGN KEY ("session_id") REFERENCES "public"."sessions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "experiments" ADD CONSTRAINT "experiments_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "experiments" ADD CONSTRAINT "experiments_source_cell_id_cells_id_fk" FOREIGN KEY ("source_cell_id") REFERENCES "public"."cells"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "experiments" ADD CONSTRAINT "experiments_upload_id_uploads_id_fk" FOREIGN KEY ("upload_id") REFERENCES "public"."uploads"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "experiments" ADD CONSTRAINT "experiments_rerun_of_experiments_id_fk" FOREIGN KEY ("rerun_of") REFERENCES "public"."experiments"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_session_id_sessions_id_fk" FOREIGN KEY ("session_id") REFERENCES "public"."sessions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "experiments_session_idx" ON "experiments" USING btree ("session_id","created_at");