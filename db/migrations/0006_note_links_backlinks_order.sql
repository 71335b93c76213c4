ALTER TABLE "note_links" ADD COLUMN "meeting_date" date;--> statement-breakpoint
ALTER TABLE "note_links" ADD COLUMN "published" boolean DEFAULT false NOT NULL;--> statement-breakpoint
CREATE INDEX "note_links_backlinks_idx" ON "note_links" USING btree ("target_type","target_id","published","meeting_date" DESC NULLS LAST,"note_id" DESC NULLS LAST);--> statement-breakpoint
UPDATE "note_links" SET "meeting_date" = n."meeting_date", "published" = (n."status" = 'published') FROM "notes" n WHERE n."id" = "note_links"."note_id";
