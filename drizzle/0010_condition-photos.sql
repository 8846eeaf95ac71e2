CREATE TABLE `condition_reports` (
	`id` text PRIMARY KEY NOT NULL,
	`object_id` text NOT NULL,
	`status` text DEFAULT 'draft' NOT NULL,
	`context` text NOT NULL,
	`report_date` text NOT NULL,
	`examiner_id` text,
	`examiner_name` text NOT NULL,
	`mounting_id` text,
	`rating` text NOT NULL,
	`unresolved_count` integer DEFAULT 0 NOT NULL,
	`current_revision` integer DEFAULT 1 NOT NULL,
	`signed_at` integer,
	`signed_by` text,
	`version` integer DEFAULT 1 NOT NULL,
	`created_by` text,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`object_id`) REFERENCES `objects`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`mounting_id`) REFERENCES `mountings`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `condition_object_idx` ON `condition_reports` (`object_id`,`report_date`);--> statement-breakpoint
CREATE INDEX `condition_date_idx` ON `condition_reports` (`report_date`,`id`);--> statement-breakpoint
CREATE INDEX `condition_rating_idx` ON `condition_reports` (`rating`,`report_date`);--> statement-breakpoint
CREATE INDEX `condition_context_idx` ON `condition_reports` (`context`,`report_date`);--> statement-breakpoint
CREATE INDEX `condition_examiner_idx` ON `condition_reports` (`examiner_id`,`report_date`);--> statement-breakpoint
CREATE TABLE `condition_revisions` (
	`id` text PRIMARY KEY NOT NULL,
	`report_id` text NOT NULL,
	`revision` integer NOT NULL,
	`data` text NOT NULL,
	`correction_reason` text,
	`created_by` text,
	`created_by_name` text,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`report_id`) REFERENCES `condition_reports`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE UNIQUE INDEX `condition_revisions_uq` ON `condition_revisions` (`report_id`,`revision`);--> statement-breakpoint
CREATE TABLE `condition_terms` (
	`id` text PRIMARY KEY NOT NULL,
	`list` text NOT NULL,
	`term` text NOT NULL,
	`caution` text,
	`sort_order` integer DEFAULT 0 NOT NULL,
	`active` integer DEFAULT true NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `condition_terms_uq` ON `condition_terms` (`list`,`term`);--> statement-breakpoint
CREATE TABLE `photos` (
	`id` text PRIMARY KEY NOT NULL,
	`object_id` text NOT NULL,
	`report_id` text,
	`kind` text NOT NULL,
	`caption` text,
	`taken_at` text,
	`mime` text NOT NULL,
	`width` integer NOT NULL,
	`height` integer NOT NULL,
	`bytes` integer NOT NULL,
	`sha256` text NOT NULL,
	`original_key` text NOT NULL,
	`full_key` text NOT NULL,
	`web_key` text NOT NULL,
	`thumb_key` text NOT NULL,
	`uploaded_by` text,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`object_id`) REFERENCES `objects`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`report_id`) REFERENCES `condition_reports`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `photos_object_idx` ON `photos` (`object_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `photos_report_idx` ON `photos` (`report_id`);--> statement-breakpoint
ALTER TABLE `studio_settings` ADD `check_interval_months` integer DEFAULT 24 NOT NULL;--> statement-breakpoint
ALTER TABLE `studio_settings` ADD `check_interval_on_loan_months` integer DEFAULT 12 NOT NULL;