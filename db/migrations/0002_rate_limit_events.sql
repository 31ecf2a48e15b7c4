CREATE TABLE "rate_limit_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"bucket" text NOT NULL,
	"key" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE INDEX "rate_limit_events_bucket_key_at_idx" ON "rate_limit_events" USING btree ("bucket","key","at");--> statement-breakpoint
CREATE INDEX "rate_limit_events_at_idx" ON "rate_limit_events" USING btree ("at");