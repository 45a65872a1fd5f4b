DROP INDEX "items_queue_lc_idx";--> statement-breakpoint
DROP INDEX "items_queue_margin_idx";--> statement-breakpoint
DROP INDEX "items_queue_entropy_idx";--> statement-breakpoint
DROP INDEX "items_queue_random_idx";--> statement-breakpoint
CREATE INDEX "items_decided_at_idx" ON "items" USING btree ("project_id","decided_at") WHERE "items"."decided_at" is not null;--> statement-breakpoint
CREATE INDEX "labels_project_created_idx" ON "labels" USING btree ("project_id","created_at");--> statement-breakpoint
CREATE INDEX "labels_project_undone_idx" ON "labels" USING btree ("project_id","undone_at") WHERE "labels"."undone_at" is not null;--> statement-breakpoint
CREATE INDEX "items_queue_lc_idx" ON "items" USING btree ("project_id","score_least_confident" desc nulls last,"seq") WHERE status in ('unlabelled', 'in_progress') and not is_control and final_class_id is null;--> statement-breakpoint
CREATE INDEX "items_queue_margin_idx" ON "items" USING btree ("project_id","score_margin" asc nulls last,"seq") WHERE status in ('unlabelled', 'in_progress') and not is_control and final_class_id is null;--> statement-breakpoint
CREATE INDEX "items_queue_entropy_idx" ON "items" USING btree ("project_id","score_entropy" desc nulls last,"seq") WHERE status in ('unlabelled', 'in_progress') and not is_control and final_class_id is null;--> statement-breakpoint
CREATE INDEX "items_queue_random_idx" ON "items" USING btree ("project_id","random_key","seq") WHERE status in ('unlabelled', 'in_progress') and not is_control and final_class_id is null;