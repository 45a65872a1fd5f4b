DROP INDEX "items_import_id_idx";--> statement-breakpoint
DROP INDEX "items_queue_lc_idx";--> statement-breakpoint
DROP INDEX "items_queue_margin_idx";--> statement-breakpoint
DROP INDEX "items_queue_entropy_idx";--> statement-breakpoint
DROP INDEX "items_pool_share_idx";--> statement-breakpoint
CREATE INDEX "items_queue_lc_idx" ON "items" USING btree ("project_id","score_least_confident" desc nulls last,"seq") WHERE status in ('unlabelled', 'in_progress') and not is_control and final_class_id is null and score_least_confident is not null;--> statement-breakpoint
CREATE INDEX "items_queue_margin_idx" ON "items" USING btree ("project_id","score_margin" asc nulls last,"seq") WHERE status in ('unlabelled', 'in_progress') and not is_control and final_class_id is null and score_margin is not null;--> statement-breakpoint
CREATE INDEX "items_queue_entropy_idx" ON "items" USING btree ("project_id","score_entropy" desc nulls last,"seq") WHERE status in ('unlabelled', 'in_progress') and not is_control and final_class_id is null and score_entropy is not null;--> statement-breakpoint
CREATE INDEX "items_pool_share_idx" ON "items" USING btree ("project_id","pool_top_share","id") WHERE "items"."pool_top_share" is not null;