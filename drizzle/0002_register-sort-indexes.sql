DROP INDEX `objects_title_idx`;--> statement-breakpoint
DROP INDEX `objects_maker_idx`;--> statement-breakpoint
DROP INDEX `objects_updated_idx`;--> statement-breakpoint
CREATE INDEX `objects_status_type_idx` ON `objects` (`status`,`object_type`,`object_number`);--> statement-breakpoint
CREATE INDEX `objects_status_sort_idx` ON `objects` (`status`,`id`);--> statement-breakpoint
CREATE INDEX `objects_title_idx` ON `objects` (`title`,`id`);--> statement-breakpoint
CREATE INDEX `objects_maker_idx` ON `objects` (`maker`,`id`);--> statement-breakpoint
CREATE INDEX `objects_updated_idx` ON `objects` (`updated_at`,`id`);