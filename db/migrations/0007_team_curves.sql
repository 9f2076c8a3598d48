CREATE TABLE "team_curves" (
	"id" text PRIMARY KEY NOT NULL,
	"team_id" text NOT NULL,
	"kind" text NOT NULL,
	"name" text NOT NULL,
	"file_name" text NOT NULL,
	"file_bytes" "bytea" NOT NULL,
	"checksum" text NOT NULL,
	"wavelength_unit" text NOT NULL,
	"value_scale" text,
	"medium" text NOT NULL,
	"corrections" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"wavelengths_nm" double precision[] NOT NULL,
	"values" double precision[] NOT NULL,
	"labels" text[],
	"uploaded_by" text,
	"uploaded_by_name" text NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	CONSTRAINT "team_curves_same_file_unique" UNIQUE NULLS NOT DISTINCT("team_id","checksum","kind","wavelength_unit","value_scale","medium")
);
--> statement-breakpoint
ALTER TABLE "team_curves" ADD CONSTRAINT "team_curves_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "team_curves" ADD CONSTRAINT "team_curves_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "team_curves_team_created_idx" ON "team_curves" USING btree ("team_id","created_at");