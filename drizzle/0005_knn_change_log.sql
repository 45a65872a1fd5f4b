CREATE TABLE "knn_changes" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"project_id" integer NOT NULL,
	"item_id" integer NOT NULL,
	"version" bigint
);
--> statement-breakpoint
ALTER TABLE "knn_changes" ADD CONSTRAINT "knn_changes_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "knn_changes_project_version_idx" ON "knn_changes" USING btree ("project_id","version");--> statement-breakpoint
-- Each change row gets the project's next version when its transaction commits: the deferred trigger runs inside COMMIT,
-- so the knn_state row lock that orders versions is held for the commit alone, never across a round trip to the app.
CREATE FUNCTION "knn_changes_assign_version"() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE v bigint;
BEGIN
  INSERT INTO knn_state AS ks (project_id, version, labels_since_pool_rank) VALUES (NEW.project_id, 2, 1)
  ON CONFLICT (project_id) DO UPDATE SET version = ks.version + 1, labels_since_pool_rank = ks.labels_since_pool_rank + 1, updated_at = now()
  RETURNING ks.version INTO v;
  UPDATE knn_changes SET version = v WHERE id = NEW.id;
  -- Every 1000th version prunes what lies 20 000 versions back (a process that far behind rebuilds anyway).
  IF v % 1000 = 0 THEN
    DELETE FROM knn_changes WHERE project_id = NEW.project_id AND version <= v - 20000;
  END IF;
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE CONSTRAINT TRIGGER "knn_changes_version" AFTER INSERT ON "knn_changes" DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION "knn_changes_assign_version"();--> statement-breakpoint
-- Rate-limit counters need no crash safety (a restart forgets at most one window): unlogged, they cost no WAL write.
ALTER TABLE "rate_limits" SET UNLOGGED;
