CREATE TABLE "map_images" (
	"id" text PRIMARY KEY NOT NULL,
	"team_id" text NOT NULL,
	"map_id" text,
	"content_type" text NOT NULL,
	"bytes" "bytea" NOT NULL,
	"byte_size" integer NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "trace_drafts" (
	"id" text PRIMARY KEY NOT NULL,
	"team_id" text NOT NULL,
	"image_id" text NOT NULL,
	"name" text NOT NULL,
	"state" jsonb NOT NULL,
	"revision" integer DEFAULT 1 NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "map_images" ADD CONSTRAINT "map_images_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "map_images" ADD CONSTRAINT "map_images_map_id_maps_id_fk" FOREIGN KEY ("map_id") REFERENCES "public"."maps"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "map_images" ADD CONSTRAINT "map_images_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "trace_drafts" ADD CONSTRAINT "trace_drafts_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "trace_drafts" ADD CONSTRAINT "trace_drafts_image_id_map_images_id_fk" FOREIGN KEY ("image_id") REFERENCES "public"."map_images"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "trace_drafts" ADD CONSTRAINT "trace_drafts_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "map_images_team_idx" ON "map_images" USING btree ("team_id");--> statement-breakpoint
CREATE INDEX "map_images_map_idx" ON "map_images" USING btree ("map_id");--> statement-breakpoint
CREATE INDEX "trace_drafts_team_idx" ON "trace_drafts" USING btree ("team_id","updated_at");