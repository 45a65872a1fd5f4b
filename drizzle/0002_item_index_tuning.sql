ALTER TABLE "items" DROP CONSTRAINT "items_import_id_imports_id_fk";
--> statement-breakpoint
DROP INDEX "items_import_id_idx";--> statement-breakpoint
DROP INDEX "items_final_class_idx";--> statement-breakpoint
DROP INDEX "items_known_class_id_idx";--> statement-breakpoint
DROP INDEX "items_prior_class_id_idx";--> statement-breakpoint
CREATE INDEX "items_pool_share_idx" ON "items" USING btree ("project_id","pool_top_share","id");--> statement-breakpoint
CREATE INDEX "items_import_id_idx" ON "items" USING btree ("import_id") WHERE "items"."import_id" is not null;--> statement-breakpoint
CREATE INDEX "items_final_class_idx" ON "items" USING btree ("project_id","final_class_id") WHERE "items"."final_class_id" is not null;--> statement-breakpoint
CREATE INDEX "items_known_class_id_idx" ON "items" USING btree ("known_class_id") WHERE "items"."known_class_id" is not null;--> statement-breakpoint
CREATE INDEX "items_prior_class_id_idx" ON "items" USING btree ("prior_class_id") WHERE "items"."prior_class_id" is not null;