CREATE TABLE "jobs" (
	"id" serial PRIMARY KEY NOT NULL,
	"queue" text NOT NULL,
	"payload" jsonb NOT NULL,
	"state" text DEFAULT 'queued' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"max_attempts" integer DEFAULT 5 NOT NULL,
	"run_at" timestamp with time zone DEFAULT now() NOT NULL,
	"locked_until" timestamp with time zone,
	"last_error" text,
	"dedupe_key" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "reminder_run_members" (
	"run_id" text NOT NULL,
	"user_id" text NOT NULL,
	"outcome" text,
	"reason" text,
	CONSTRAINT "reminder_run_members_run_id_user_id_pk" PRIMARY KEY("run_id","user_id")
);
--> statement-breakpoint
CREATE TABLE "reminder_runs" (
	"id" text PRIMARY KEY NOT NULL,
	"week_of" date NOT NULL,
	"requested_by" text,
	"total" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "reminder_sends" (
	"id" serial PRIMARY KEY NOT NULL,
	"week_of" date NOT NULL,
	"user_id" text NOT NULL,
	"run_id" text NOT NULL,
	"state" text NOT NULL,
	"reason" text,
	"message_id" text,
	"tasks" integer DEFAULT 0 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "outbox_messages" ADD COLUMN "message_id" text;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "reminder_opt_in" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "reminder_run_members" ADD CONSTRAINT "reminder_run_members_run_id_reminder_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."reminder_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reminder_run_members" ADD CONSTRAINT "reminder_run_members_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reminder_runs" ADD CONSTRAINT "reminder_runs_requested_by_users_id_fk" FOREIGN KEY ("requested_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reminder_sends" ADD CONSTRAINT "reminder_sends_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reminder_sends" ADD CONSTRAINT "reminder_sends_run_id_reminder_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."reminder_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "jobs_due_idx" ON "jobs" USING btree ("state","run_at");--> statement-breakpoint
CREATE UNIQUE INDEX "jobs_dedupe_idx" ON "jobs" USING btree ("dedupe_key");--> statement-breakpoint
CREATE INDEX "reminder_runs_created_idx" ON "reminder_runs" USING btree ("created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "reminder_sends_week_user_uq" ON "reminder_sends" USING btree ("week_of","user_id");--> statement-breakpoint
CREATE INDEX "reminder_sends_run_idx" ON "reminder_sends" USING btree ("run_id");--> statement-breakpoint
CREATE UNIQUE INDEX "outbox_message_id_idx" ON "outbox_messages" USING btree ("message_id");