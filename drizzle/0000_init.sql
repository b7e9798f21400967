CREATE TABLE "users" (
	"id" serial PRIMARY KEY NOT NULL,
	"provider" text DEFAULT 'github' NOT NULL,
	"provider_id" text NOT NULL,
	"login" text NOT NULL,
	"name" text,
	"email" text,
	"avatar_url" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX "users_provider_id_idx" ON "users" USING btree ("provider","provider_id");