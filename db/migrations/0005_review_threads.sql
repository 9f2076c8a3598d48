CREATE TABLE "inbox_items" (
	"id" text PRIMARY KEY NOT NULL,
	"seq" integer GENERATED ALWAYS AS IDENTITY (sequence name "inbox_items_seq_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"user_id" text NOT NULL,
	"kind" text NOT NULL,
	"design_id" text NOT NULL,
	"version_number" integer NOT NULL,
	"thread_id" text,
	"actor_id" text,
	"excerpt" text NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	"read_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "mail_settings" (
	"user_id" text PRIMARY KEY NOT NULL,
	"review_requests" boolean DEFAULT true NOT NULL,
	"mentions" boolean DEFAULT true NOT NULL,
	"threads_on_my_designs" boolean DEFAULT true NOT NULL,
	"decisions_on_my_versions" boolean DEFAULT true NOT NULL
);
--> statement-breakpoint
CREATE TABLE "review_decisions" (
	"id" text PRIMARY KEY NOT NULL,
	"seq" integer GENERATED ALWAYS AS IDENTITY (sequence name "review_decisions_seq_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"design_id" text NOT NULL,
	"version_number" integer NOT NULL,
	"reviewer_id" text,
	"reviewer_name" text NOT NULL,
	"outcome" text NOT NULL,
	"summary" text NOT NULL,
	"created_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
CREATE TABLE "review_remarks" (
	"id" text PRIMARY KEY NOT NULL,
	"seq" integer GENERATED ALWAYS AS IDENTITY (sequence name "review_remarks_seq_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"thread_id" text NOT NULL,
	"author_id" text,
	"author_name" text NOT NULL,
	"body" text,
	"mentions" text[] DEFAULT '{}'::text[] NOT NULL,
	"earlier_bodies" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	"edited_at" timestamp with time zone,
	"removed_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "review_requests" (
	"id" text PRIMARY KEY NOT NULL,
	"design_id" text NOT NULL,
	"version_number" integer NOT NULL,
	"requested_by" text,
	"reviewer_id" text NOT NULL,
	"due_date" text,
	"note" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	"answered_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "review_threads" (
	"id" text PRIMARY KEY NOT NULL,
	"seq" integer GENERATED ALWAYS AS IDENTITY (sequence name "review_threads_seq_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"design_id" text NOT NULL,
	"version_number" integer NOT NULL,
	"pin" jsonb NOT NULL,
	"pinned_value" jsonb,
	"status" text DEFAULT 'open' NOT NULL,
	"created_by" text,
	"created_by_name" text NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	"resolved_by" text,
	"resolved_at" timestamp with time zone,
	"status_events" jsonb DEFAULT '[]'::jsonb NOT NULL
);
--> statement-breakpoint
ALTER TABLE "inbox_items" ADD CONSTRAINT "inbox_items_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inbox_items" ADD CONSTRAINT "inbox_items_design_id_designs_id_fk" FOREIGN KEY ("design_id") REFERENCES "public"."designs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inbox_items" ADD CONSTRAINT "inbox_items_thread_id_review_threads_id_fk" FOREIGN KEY ("thread_id") REFERENCES "public"."review_threads"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inbox_items" ADD CONSTRAINT "inbox_items_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mail_settings" ADD CONSTRAINT "mail_settings_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_decisions" ADD CONSTRAINT "review_decisions_design_id_designs_id_fk" FOREIGN KEY ("design_id") REFERENCES "public"."designs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_decisions" ADD CONSTRAINT "review_decisions_reviewer_id_users_id_fk" FOREIGN KEY ("reviewer_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_remarks" ADD CONSTRAINT "review_remarks_thread_id_review_threads_id_fk" FOREIGN KEY ("thread_id") REFERENCES "public"."review_threads"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_remarks" ADD CONSTRAINT "review_remarks_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_requests" ADD CONSTRAINT "review_requests_design_id_designs_id_fk" FOREIGN KEY ("design_id") REFERENCES "public"."designs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_requests" ADD CONSTRAINT "review_requests_requested_by_users_id_fk" FOREIGN KEY ("requested_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_requests" ADD CONSTRAINT "review_requests_reviewer_id_users_id_fk" FOREIGN KEY ("reviewer_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_threads" ADD CONSTRAINT "review_threads_design_id_designs_id_fk" FOREIGN KEY ("design_id") REFERENCES "public"."designs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_threads" ADD CONSTRAINT "review_threads_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_threads" ADD CONSTRAINT "review_threads_resolved_by_users_id_fk" FOREIGN KEY ("resolved_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "inbox_items_user_seq_idx" ON "inbox_items" USING btree ("user_id","seq");--> statement-breakpoint
CREATE INDEX "review_decisions_design_version_idx" ON "review_decisions" USING btree ("design_id","version_number","seq");--> statement-breakpoint
CREATE INDEX "review_remarks_thread_idx" ON "review_remarks" USING btree ("thread_id","seq");--> statement-breakpoint
CREATE UNIQUE INDEX "review_requests_version_reviewer_unique" ON "review_requests" USING btree ("design_id","version_number","reviewer_id");--> statement-breakpoint
CREATE INDEX "review_threads_design_version_idx" ON "review_threads" USING btree ("design_id","version_number","seq");--> statement-breakpoint
-- Comments written before pinned threads existed become open threads on their whole version, with their text as the first remark; nothing is dropped.
INSERT INTO "review_threads" ("id", "design_id", "version_number", "pin", "status", "created_by", "created_by_name", "created_at")
SELECT r."id", r."design_id", r."version_number", '{"kind":"version"}'::jsonb, 'open', r."author_id", coalesce(u."display_name", 'Former member'), r."created_at"
FROM "version_reviews" r LEFT JOIN "users" u ON u."id" = r."author_id"
WHERE r."decision" IS NULL
ORDER BY r."seq";--> statement-breakpoint
INSERT INTO "review_remarks" ("id", "thread_id", "author_id", "author_name", "body", "created_at")
SELECT r."id" || ':remark', r."id", r."author_id", coalesce(u."display_name", 'Former member'), r."body", r."created_at"
FROM "version_reviews" r LEFT JOIN "users" u ON u."id" = r."author_id"
WHERE r."decision" IS NULL
ORDER BY r."seq";--> statement-breakpoint
-- Old decisions keep their text as the summary: approved reads as signed off, changes requested as revise.
INSERT INTO "review_decisions" ("id", "design_id", "version_number", "reviewer_id", "reviewer_name", "outcome", "summary", "created_at")
SELECT r."id", r."design_id", r."version_number", r."author_id", coalesce(u."display_name", 'Former member'),
  CASE r."decision" WHEN 'approved' THEN 'signed-off' ELSE 'revise' END, r."body", r."created_at"
FROM "version_reviews" r LEFT JOIN "users" u ON u."id" = r."author_id"
WHERE r."decision" IS NOT NULL
ORDER BY r."seq";
