-- Keys made before keys had a role take the role their user has in the key's workspace now, so nothing
-- they may do changes today; a key whose user has left the workspace (it already reached nothing) becomes
-- a viewer key. From here on a key acts with the lower of this role and its user's current role.
ALTER TABLE "api_key" ADD COLUMN "role" text;--> statement-breakpoint
UPDATE "api_key" SET "role" = COALESCE(
  (SELECT "workspace_member"."role" FROM "workspace_member"
    WHERE "workspace_member"."workspace_id" = "api_key"."workspace_id" AND "workspace_member"."user_id" = "api_key"."user_id"),
  'viewer');--> statement-breakpoint
ALTER TABLE "api_key" ALTER COLUMN "role" SET NOT NULL;--> statement-breakpoint
CREATE INDEX "api_key_workspace_id_idx" ON "api_key" USING btree ("workspace_id");--> statement-breakpoint
ALTER TABLE "api_key" ADD CONSTRAINT "api_key_role_check" CHECK ("api_key"."role" in ('owner', 'editor', 'viewer'));
