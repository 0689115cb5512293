CREATE TABLE "log_mapping_presets" (
	"id" text PRIMARY KEY NOT NULL,
	"team_id" text NOT NULL,
	"name" text NOT NULL,
	"mapping" jsonb NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "study_logs" (
	"id" text PRIMARY KEY NOT NULL,
	"team_id" text NOT NULL,
	"study_id" text NOT NULL,
	"name" text NOT NULL,
	"logged_on" date,
	"notes" text DEFAULT '' NOT NULL,
	"mapping" jsonb NOT NULL,
	"source_checksum" text NOT NULL,
	"source_name" text DEFAULT '' NOT NULL,
	"source_bytes" integer NOT NULL,
	"row_count" integer NOT NULL,
	"duration" double precision NOT NULL,
	"channels" jsonb NOT NULL,
	"skipped" jsonb NOT NULL,
	"selection" jsonb,
	"samples" "bytea" NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "log_mapping_presets" ADD CONSTRAINT "log_mapping_presets_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "log_mapping_presets" ADD CONSTRAINT "log_mapping_presets_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "study_logs" ADD CONSTRAINT "study_logs_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "study_logs" ADD CONSTRAINT "study_logs_study_id_studies_id_fk" FOREIGN KEY ("study_id") REFERENCES "public"."studies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "study_logs" ADD CONSTRAINT "study_logs_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "log_mapping_presets_team_name_unique" ON "log_mapping_presets" USING btree ("team_id","name");--> statement-breakpoint
CREATE INDEX "study_logs_study_idx" ON "study_logs" USING btree ("team_id","study_id","created_at");