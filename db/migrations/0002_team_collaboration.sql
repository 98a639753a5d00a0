CREATE TABLE "mail_message" (
	"id" text PRIMARY KEY NOT NULL,
	"team_id" text,
	"kind" text NOT NULL,
	"to_address" text NOT NULL,
	"to_user_id" text,
	"subject" text NOT NULL,
	"text_body" text NOT NULL,
	"html_body" text,
	"status" text NOT NULL,
	"error" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"sent_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "run_review" (
	"id" text PRIMARY KEY NOT NULL,
	"run_id" text NOT NULL,
	"from_state" text NOT NULL,
	"to_state" text NOT NULL,
	"actor_id" text,
	"note" text DEFAULT '' NOT NULL,
	"run_input_hash" text NOT NULL,
	"scene_version" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "study_presence" (
	"id" text PRIMARY KEY NOT NULL,
	"study_id" text NOT NULL,
	"user_id" text NOT NULL,
	"last_seen_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "study_share_link" (
	"id" text PRIMARY KEY NOT NULL,
	"study_id" text NOT NULL,
	"token_hash" text NOT NULL,
	"label" text DEFAULT '' NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"revoked_at" timestamp with time zone,
	"revoked_by" text
);
--> statement-breakpoint
ALTER TABLE "comment" ADD COLUMN "resolved_by" text;--> statement-breakpoint
ALTER TABLE "comment" ADD COLUMN "mentions" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "comment" ADD COLUMN "edited_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "comment" ADD COLUMN "deleted_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "invitation" ADD COLUMN "token_hash" text;--> statement-breakpoint
ALTER TABLE "invitation" ADD COLUMN "accepted_at" timestamp;--> statement-breakpoint
ALTER TABLE "invitation" ADD COLUMN "accepted_by" text;--> statement-breakpoint
ALTER TABLE "run" ADD COLUMN "review_state" text DEFAULT 'unreviewed' NOT NULL;--> statement-breakpoint
ALTER TABLE "scene" ADD COLUMN "forked_from_author_id" text;--> statement-breakpoint
ALTER TABLE "mail_message" ADD CONSTRAINT "mail_message_team_id_team_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."team"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mail_message" ADD CONSTRAINT "mail_message_to_user_id_user_id_fk" FOREIGN KEY ("to_user_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_review" ADD CONSTRAINT "run_review_run_id_run_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."run"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_review" ADD CONSTRAINT "run_review_actor_id_user_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "study_presence" ADD CONSTRAINT "study_presence_study_id_study_id_fk" FOREIGN KEY ("study_id") REFERENCES "public"."study"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "study_presence" ADD CONSTRAINT "study_presence_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "study_share_link" ADD CONSTRAINT "study_share_link_study_id_study_id_fk" FOREIGN KEY ("study_id") REFERENCES "public"."study"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "study_share_link" ADD CONSTRAINT "study_share_link_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "study_share_link" ADD CONSTRAINT "study_share_link_revoked_by_user_id_fk" FOREIGN KEY ("revoked_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "mail_message_team_id_idx" ON "mail_message" USING btree ("team_id","created_at");--> statement-breakpoint
CREATE INDEX "run_review_run_id_idx" ON "run_review" USING btree ("run_id","created_at");--> statement-breakpoint
CREATE INDEX "study_presence_study_id_idx" ON "study_presence" USING btree ("study_id","last_seen_at");--> statement-breakpoint
CREATE UNIQUE INDEX "study_share_link_token_hash_uidx" ON "study_share_link" USING btree ("token_hash");--> statement-breakpoint
CREATE INDEX "study_share_link_study_id_idx" ON "study_share_link" USING btree ("study_id");--> statement-breakpoint
ALTER TABLE "comment" ADD CONSTRAINT "comment_resolved_by_user_id_fk" FOREIGN KEY ("resolved_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitation" ADD CONSTRAINT "invitation_accepted_by_user_id_fk" FOREIGN KEY ("accepted_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scene" ADD CONSTRAINT "scene_forked_from_author_id_user_id_fk" FOREIGN KEY ("forked_from_author_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "invitation_token_hash_uidx" ON "invitation" USING btree ("token_hash");--> statement-breakpoint
CREATE INDEX "scene_forked_from_idx" ON "scene" USING btree ("forked_from_scene_id");