CREATE TABLE `custody_receipts` (
	`id` text PRIMARY KEY NOT NULL,
	`object_id` text NOT NULL,
	`direction` text NOT NULL,
	`kind` text NOT NULL,
	`date` text NOT NULL,
	`from_party` text NOT NULL,
	`to_party` text NOT NULL,
	`condition` text NOT NULL,
	`signed_by` text NOT NULL,
	`notes` text,
	`created_by` text,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`object_id`) REFERENCES `objects`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `custody_object_idx` ON `custody_receipts` (`object_id`,`date`);--> statement-breakpoint
CREATE INDEX `custody_date_idx` ON `custody_receipts` (`date`,`id`);--> statement-breakpoint
CREATE TABLE `events` (
	`seq` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`object_id` text NOT NULL,
	`type` text NOT NULL,
	`at` integer NOT NULL,
	`actor_id` text,
	`actor_name` text NOT NULL,
	`summary` text NOT NULL,
	`data` text NOT NULL,
	`prev_hash` text,
	`hash` text NOT NULL,
	FOREIGN KEY (`object_id`) REFERENCES `objects`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `events_object_idx` ON `events` (`object_id`,`seq`);--> statement-breakpoint
CREATE INDEX `events_type_idx` ON `events` (`object_id`,`type`,`seq`);--> statement-breakpoint
CREATE TABLE `mounting_batches` (
	`mounting_id` text NOT NULL,
	`revision` integer NOT NULL,
	`role` text NOT NULL,
	`batch` text NOT NULL,
	FOREIGN KEY (`mounting_id`) REFERENCES `mountings`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `mounting_batches_batch_idx` ON `mounting_batches` (`batch`);--> statement-breakpoint
CREATE INDEX `mounting_batches_mounting_idx` ON `mounting_batches` (`mounting_id`,`revision`);--> statement-breakpoint
CREATE TABLE `mounting_revisions` (
	`id` text PRIMARY KEY NOT NULL,
	`mounting_id` text NOT NULL,
	`revision` integer NOT NULL,
	`data` text NOT NULL,
	`correction_reason` text,
	`created_by` text,
	`created_by_name` text,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`mounting_id`) REFERENCES `mountings`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE UNIQUE INDEX `mounting_revisions_uq` ON `mounting_revisions` (`mounting_id`,`revision`);--> statement-breakpoint
CREATE TABLE `mountings` (
	`id` text PRIMARY KEY NOT NULL,
	`object_id` text NOT NULL,
	`status` text DEFAULT 'draft' NOT NULL,
	`reason` text NOT NULL,
	`mounted_on` text NOT NULL,
	`framer_id` text,
	`framer_name` text NOT NULL,
	`current_revision` integer DEFAULT 1 NOT NULL,
	`method` text,
	`board_grade` text,
	`glazing` text,
	`superseded_by_id` text,
	`completed_at` integer,
	`completed_by` text,
	`ended_on` text,
	`end_reason` text,
	`version` integer DEFAULT 1 NOT NULL,
	`created_by` text,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`object_id`) REFERENCES `objects`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `mountings_object_idx` ON `mountings` (`object_id`,`mounted_on`);--> statement-breakpoint
CREATE INDEX `mountings_date_idx` ON `mountings` (`mounted_on`,`id`);--> statement-breakpoint
CREATE INDEX `mountings_framer_idx` ON `mountings` (`framer_id`,`mounted_on`);--> statement-breakpoint
CREATE INDEX `mountings_method_idx` ON `mountings` (`method`,`mounted_on`);--> statement-breakpoint
CREATE INDEX `mountings_status_idx` ON `mountings` (`status`,`mounted_on`);--> statement-breakpoint
ALTER TABLE `objects` ADD `current_mounting_id` text;--> statement-breakpoint
ALTER TABLE `objects` ADD `current_method` text;--> statement-breakpoint
ALTER TABLE `objects` ADD `current_board_grade` text;--> statement-breakpoint
ALTER TABLE `objects` ADD `current_glazing` text;--> statement-breakpoint
ALTER TABLE `objects` ADD `last_mounted_on` text;--> statement-breakpoint
ALTER TABLE `objects` ADD `last_condition_on` text;--> statement-breakpoint
ALTER TABLE `objects` ADD `check_due_on` text;--> statement-breakpoint
CREATE INDEX `objects_method_idx` ON `objects` (`current_method`,`object_number`);--> statement-breakpoint
CREATE INDEX `objects_board_idx` ON `objects` (`current_board_grade`,`object_number`);--> statement-breakpoint
CREATE INDEX `objects_glazing_idx` ON `objects` (`current_glazing`,`object_number`);--> statement-breakpoint
CREATE INDEX `objects_last_mounted_idx` ON `objects` (`last_mounted_on`,`id`);--> statement-breakpoint
CREATE INDEX `objects_check_due_idx` ON `objects` (`check_due_on`,`id`);