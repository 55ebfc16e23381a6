ALTER TABLE "users" ADD COLUMN "locale" text;
