-- Sessions are stored by the SHA-256 of their id from now on: hash the ids already stored, so
-- everyone signed in stays signed in (their cookie still holds the id; the server hashes it).
UPDATE "sessions" SET "id" = encode(sha256(convert_to("id", 'UTF8')), 'hex');--> statement-breakpoint
-- Accounts made before addresses were confirmed keep what they could do.
UPDATE "users" SET "email_confirmed_at" = "created_at" WHERE "email_confirmed_at" IS NULL;
