ALTER TABLE `events` ADD `occurred_on` text;--> statement-breakpoint
CREATE INDEX `events_occurred_idx` ON `events` (`object_id`,`occurred_on`,`seq`);