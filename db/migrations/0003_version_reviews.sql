CREATE TABLE "version_reviews" (
	"id" text PRIMARY KEY NOT NULL,
	"seq" integer GENERATED ALWAYS AS IDENTITY (sequence name "version_reviews_seq_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"design_id" text NOT NULL,
	"version_number" integer NOT NULL,
	"author_id" text,
	"body" text NOT NULL,
	"decision" text,
	"created_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
ALTER TABLE "version_reviews" ADD CONSTRAINT "version_reviews_design_id_designs_id_fk" FOREIGN KEY ("design_id") REFERENCES "public"."designs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "version_reviews" ADD CONSTRAINT "version_reviews_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "version_reviews_design_version_idx" ON "version_reviews" USING btree ("design_id","version_number","seq");