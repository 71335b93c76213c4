ALTER TABLE "answers" ADD COLUMN "idempotency_key" text;--> statement-breakpoint
ALTER TABLE "answers" ADD COLUMN "phone_result" jsonb;--> statement-breakpoint
CREATE UNIQUE INDEX "answers_user_idempotency_idx" ON "answers" USING btree ("user_id","idempotency_key");