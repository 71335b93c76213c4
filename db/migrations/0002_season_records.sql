CREATE TABLE "temperature_days" (
	"record_id" text NOT NULL,
	"day" date NOT NULL,
	"tmin" real NOT NULL,
	"tmax" real NOT NULL,
	CONSTRAINT "temperature_days_record_id_day_pk" PRIMARY KEY("record_id","day")
);
--> statement-breakpoint
CREATE TABLE "temperature_records" (
	"id" text PRIMARY KEY NOT NULL,
	"scope_key" text NOT NULL,
	"owner_id" text,
	"name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "temperature_records_scope_key_unique" UNIQUE("scope_key")
);
--> statement-breakpoint
CREATE TABLE "tree_observations" (
	"id" serial PRIMARY KEY NOT NULL,
	"tree_id" text NOT NULL,
	"owner_id" text NOT NULL,
	"observed_on" date NOT NULL,
	"shoot" text,
	"task" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "temperature_days" ADD CONSTRAINT "temperature_days_record_id_temperature_records_id_fk" FOREIGN KEY ("record_id") REFERENCES "public"."temperature_records"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "temperature_records" ADD CONSTRAINT "temperature_records_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tree_observations" ADD CONSTRAINT "tree_observations_tree_id_trees_id_fk" FOREIGN KEY ("tree_id") REFERENCES "public"."trees"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tree_observations" ADD CONSTRAINT "tree_observations_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "tree_observations_tree_idx" ON "tree_observations" USING btree ("tree_id","observed_on");