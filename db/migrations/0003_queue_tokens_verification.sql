CREATE TABLE "api_token" (
	"id" text PRIMARY KEY NOT NULL,
	"user_id" text NOT NULL,
	"team_id" text NOT NULL,
	"role" text NOT NULL,
	"name" text NOT NULL,
	"token_hash" text NOT NULL,
	"token_prefix" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"expires_at" timestamp with time zone,
	"last_used_at" timestamp with time zone,
	"revoked_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "run_job" (
	"id" text PRIMARY KEY NOT NULL,
	"team_id" text NOT NULL,
	"study_id" text NOT NULL,
	"scene_id" text,
	"scene_version" integer NOT NULL,
	"kind" text DEFAULT 'run' NOT NULL,
	"sweep_id" text,
	"sweep_run_id" text,
	"case_index" integer,
	"label" text DEFAULT '' NOT NULL,
	"scene" jsonb NOT NULL,
	"settings" jsonb NOT NULL,
	"cell_steps" double precision NOT NULL,
	"state" text DEFAULT 'queued' NOT NULL,
	"queue_job_id" text,
	"worker_id" text,
	"attempt" integer DEFAULT 0 NOT NULL,
	"max_attempts" integer DEFAULT 3 NOT NULL,
	"progress" real DEFAULT 0 NOT NULL,
	"cell_updates_per_second" double precision,
	"progress_at" timestamp with time zone,
	"failures" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"message" text DEFAULT '' NOT NULL,
	"cancel_requested_at" timestamp with time zone,
	"cancelled_by" text,
	"run_id" text,
	"result_traces" "bytea",
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "run_verification" (
	"run_id" text NOT NULL,
	"verification_id" text NOT NULL,
	"attached_by" text,
	"attached_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "run_verification_run_id_verification_id_pk" PRIMARY KEY("run_id","verification_id")
);
--> statement-breakpoint
CREATE TABLE "sweep_batch" (
	"id" text PRIMARY KEY NOT NULL,
	"team_id" text NOT NULL,
	"study_id" text NOT NULL,
	"scene_id" text,
	"scene_version" integer NOT NULL,
	"definition" jsonb NOT NULL,
	"label" text DEFAULT '' NOT NULL,
	"state" text DEFAULT 'queued' NOT NULL,
	"message" text DEFAULT '' NOT NULL,
	"block_id" text,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "verification_record" (
	"id" text PRIMARY KEY NOT NULL,
	"team_id" text NOT NULL,
	"solver_version" text NOT NULL,
	"browser" text NOT NULL,
	"kernel" text DEFAULT '' NOT NULL,
	"outcomes" jsonb NOT NULL,
	"passed_count" integer NOT NULL,
	"failed_count" integer NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "api_token" ADD CONSTRAINT "api_token_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "api_token" ADD CONSTRAINT "api_token_team_id_team_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."team"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_job" ADD CONSTRAINT "run_job_team_id_team_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."team"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_job" ADD CONSTRAINT "run_job_study_id_study_id_fk" FOREIGN KEY ("study_id") REFERENCES "public"."study"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_job" ADD CONSTRAINT "run_job_scene_id_scene_id_fk" FOREIGN KEY ("scene_id") REFERENCES "public"."scene"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_job" ADD CONSTRAINT "run_job_sweep_id_sweep_batch_id_fk" FOREIGN KEY ("sweep_id") REFERENCES "public"."sweep_batch"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_job" ADD CONSTRAINT "run_job_cancelled_by_user_id_fk" FOREIGN KEY ("cancelled_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_job" ADD CONSTRAINT "run_job_run_id_run_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."run"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_job" ADD CONSTRAINT "run_job_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_verification" ADD CONSTRAINT "run_verification_run_id_run_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."run"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_verification" ADD CONSTRAINT "run_verification_verification_id_verification_record_id_fk" FOREIGN KEY ("verification_id") REFERENCES "public"."verification_record"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_verification" ADD CONSTRAINT "run_verification_attached_by_user_id_fk" FOREIGN KEY ("attached_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sweep_batch" ADD CONSTRAINT "sweep_batch_team_id_team_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."team"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sweep_batch" ADD CONSTRAINT "sweep_batch_study_id_study_id_fk" FOREIGN KEY ("study_id") REFERENCES "public"."study"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sweep_batch" ADD CONSTRAINT "sweep_batch_scene_id_scene_id_fk" FOREIGN KEY ("scene_id") REFERENCES "public"."scene"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sweep_batch" ADD CONSTRAINT "sweep_batch_block_id_study_block_id_fk" FOREIGN KEY ("block_id") REFERENCES "public"."study_block"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sweep_batch" ADD CONSTRAINT "sweep_batch_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "verification_record" ADD CONSTRAINT "verification_record_team_id_team_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."team"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "verification_record" ADD CONSTRAINT "verification_record_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "api_token_token_hash_uidx" ON "api_token" USING btree ("token_hash");--> statement-breakpoint
CREATE INDEX "api_token_user_id_idx" ON "api_token" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "run_job_team_state_idx" ON "run_job" USING btree ("team_id","state");--> statement-breakpoint
CREATE INDEX "run_job_study_id_idx" ON "run_job" USING btree ("study_id","created_at");--> statement-breakpoint
CREATE INDEX "run_job_sweep_id_idx" ON "run_job" USING btree ("sweep_id");--> statement-breakpoint
CREATE UNIQUE INDEX "run_job_run_id_uidx" ON "run_job" USING btree ("run_id");--> statement-breakpoint
CREATE INDEX "sweep_batch_study_id_idx" ON "sweep_batch" USING btree ("study_id","created_at");--> statement-breakpoint
CREATE INDEX "verification_record_team_id_idx" ON "verification_record" USING btree ("team_id","created_at");