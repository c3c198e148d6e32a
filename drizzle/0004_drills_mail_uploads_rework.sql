CREATE TYPE "public"."miss_kind" AS ENUM('out-of-order', 'wrong-pin', 'broken-pattern', 'wrong-wrench-setting', 'failed-final-check');--> statement-breakpoint
CREATE TYPE "public"."sign_off_outcome" AS ENUM('pass', 'redo');--> statement-breakpoint
CREATE TYPE "public"."upload_purpose" AS ENUM('bench-photo', 'procedure-reference');--> statement-breakpoint
CREATE TABLE "class_invitations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"class_id" uuid NOT NULL,
	"email" text NOT NULL,
	"name" text,
	"invited_by" text NOT NULL,
	"sent_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "drill_reminders" (
	"drill_id" uuid NOT NULL,
	"user_id" text NOT NULL,
	"sent_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "drill_reminders_drill_id_user_id_pk" PRIMARY KEY("drill_id","user_id")
);
--> statement-breakpoint
CREATE TABLE "drills" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"class_id" uuid NOT NULL,
	"procedure_version_id" uuid NOT NULL,
	"stages" "stage"[] NOT NULL,
	"due_at" timestamp with time zone NOT NULL,
	"pass_mark_pct" integer NOT NULL,
	"attempt_limit" integer,
	"answers_after_due" boolean DEFAULT false NOT NULL,
	"closed_at" timestamp with time zone,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "password_reset_tokens" (
	"token_hash" text PRIMARY KEY NOT NULL,
	"user_id" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"used_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "rework_answers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"item_id" uuid NOT NULL,
	"user_id" text NOT NULL,
	"client_id" uuid NOT NULL,
	"answer" jsonb NOT NULL,
	"correct" boolean NOT NULL,
	"rating" integer NOT NULL,
	"results" jsonb NOT NULL,
	"due_before" timestamp with time zone NOT NULL,
	"due_after" timestamp with time zone NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "rework_answers_user_client_uq" UNIQUE("user_id","client_id")
);
--> statement-breakpoint
CREATE TABLE "rework_items" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" text NOT NULL,
	"procedure_version_id" uuid NOT NULL,
	"stage" "stage" NOT NULL,
	"item_key" text NOT NULL,
	"miss_kind" "miss_kind" NOT NULL,
	"due" timestamp with time zone NOT NULL,
	"card" jsonb NOT NULL,
	"miss_count" integer DEFAULT 1 NOT NULL,
	"last_missed_at" timestamp with time zone NOT NULL,
	"source_attempt_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "rework_items_user_item_uq" UNIQUE("user_id","procedure_version_id","stage","item_key")
);
--> statement-breakpoint
CREATE TABLE "sign_off_photos" (
	"sign_off_id" uuid NOT NULL,
	"upload_id" uuid NOT NULL,
	CONSTRAINT "sign_off_photos_sign_off_id_upload_id_pk" PRIMARY KEY("sign_off_id","upload_id")
);
--> statement-breakpoint
CREATE TABLE "sign_offs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"class_id" uuid NOT NULL,
	"learner_id" text NOT NULL,
	"procedure_id" uuid NOT NULL,
	"instructor_id" text NOT NULL,
	"bench_date" date NOT NULL,
	"outcome" "sign_off_outcome" NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "uploads" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"owner_id" text NOT NULL,
	"purpose" "upload_purpose" NOT NULL,
	"procedure_id" uuid,
	"storage_key" text NOT NULL,
	"content_type" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"original_name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "uploads_storage_key_unique" UNIQUE("storage_key")
);
--> statement-breakpoint
ALTER TABLE "attempts" ADD COLUMN "drill_id" uuid;--> statement-breakpoint
ALTER TABLE "class_invitations" ADD CONSTRAINT "class_invitations_class_id_classes_id_fk" FOREIGN KEY ("class_id") REFERENCES "public"."classes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "class_invitations" ADD CONSTRAINT "class_invitations_invited_by_users_id_fk" FOREIGN KEY ("invited_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "drill_reminders" ADD CONSTRAINT "drill_reminders_drill_id_drills_id_fk" FOREIGN KEY ("drill_id") REFERENCES "public"."drills"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "drill_reminders" ADD CONSTRAINT "drill_reminders_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "drills" ADD CONSTRAINT "drills_class_id_classes_id_fk" FOREIGN KEY ("class_id") REFERENCES "public"."classes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "drills" ADD CONSTRAINT "drills_procedure_version_id_procedure_versions_id_fk" FOREIGN KEY ("procedure_version_id") REFERENCES "public"."procedure_versions"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "drills" ADD CONSTRAINT "drills_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "password_reset_tokens" ADD CONSTRAINT "password_reset_tokens_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rework_answers" ADD CONSTRAINT "rework_answers_item_id_rework_items_id_fk" FOREIGN KEY ("item_id") REFERENCES "public"."rework_items"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rework_answers" ADD CONSTRAINT "rework_answers_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rework_items" ADD CONSTRAINT "rework_items_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rework_items" ADD CONSTRAINT "rework_items_procedure_version_id_procedure_versions_id_fk" FOREIGN KEY ("procedure_version_id") REFERENCES "public"."procedure_versions"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rework_items" ADD CONSTRAINT "rework_items_source_attempt_id_attempts_id_fk" FOREIGN KEY ("source_attempt_id") REFERENCES "public"."attempts"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_off_photos" ADD CONSTRAINT "sign_off_photos_sign_off_id_sign_offs_id_fk" FOREIGN KEY ("sign_off_id") REFERENCES "public"."sign_offs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_off_photos" ADD CONSTRAINT "sign_off_photos_upload_id_uploads_id_fk" FOREIGN KEY ("upload_id") REFERENCES "public"."uploads"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD CONSTRAINT "sign_offs_class_id_classes_id_fk" FOREIGN KEY ("class_id") REFERENCES "public"."classes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD CONSTRAINT "sign_offs_learner_id_users_id_fk" FOREIGN KEY ("learner_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD CONSTRAINT "sign_offs_procedure_id_procedures_id_fk" FOREIGN KEY ("procedure_id") REFERENCES "public"."procedures"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD CONSTRAINT "sign_offs_instructor_id_users_id_fk" FOREIGN KEY ("instructor_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_procedure_id_procedures_id_fk" FOREIGN KEY ("procedure_id") REFERENCES "public"."procedures"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "class_invitations_class_idx" ON "class_invitations" USING btree ("class_id");--> statement-breakpoint
CREATE INDEX "drills_class_idx" ON "drills" USING btree ("class_id");--> statement-breakpoint
CREATE INDEX "password_reset_tokens_user_idx" ON "password_reset_tokens" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "rework_answers_item_idx" ON "rework_answers" USING btree ("item_id");--> statement-breakpoint
CREATE INDEX "rework_items_user_due_idx" ON "rework_items" USING btree ("user_id","due");--> statement-breakpoint
CREATE INDEX "sign_offs_class_learner_idx" ON "sign_offs" USING btree ("class_id","learner_id");--> statement-breakpoint
CREATE INDEX "uploads_owner_procedure_idx" ON "uploads" USING btree ("owner_id","procedure_id");--> statement-breakpoint
ALTER TABLE "attempts" ADD CONSTRAINT "attempts_drill_id_drills_id_fk" FOREIGN KEY ("drill_id") REFERENCES "public"."drills"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "attempts_drill_user_idx" ON "attempts" USING btree ("drill_id","user_id");