CREATE TABLE `account` (
	`id` text PRIMARY KEY NOT NULL,
	`account_id` text NOT NULL,
	`provider_id` text NOT NULL,
	`user_id` text NOT NULL,
	`access_token` text,
	`refresh_token` text,
	`id_token` text,
	`access_token_expires_at` integer,
	`refresh_token_expires_at` integer,
	`scope` text,
	`password` text,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `account_user_idx` ON `account` (`user_id`);--> statement-breakpoint
CREATE TABLE `clients` (
	`id` text PRIMARY KEY NOT NULL,
	`kind` text NOT NULL,
	`name` text NOT NULL,
	`contact_name` text,
	`email` text,
	`phone` text,
	`address` text,
	`notes` text,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL
);
--> statement-breakpoint
CREATE INDEX `clients_name_idx` ON `clients` (`name`);--> statement-breakpoint
CREATE TABLE `objects` (
	`id` text PRIMARY KEY NOT NULL,
	`object_number` text NOT NULL,
	`title` text NOT NULL,
	`maker` text,
	`date_made` text,
	`object_type` text NOT NULL,
	`medium` text,
	`support` text,
	`photo_process` text,
	`edition` text,
	`inscriptions` text,
	`sheet_width_mm` real NOT NULL,
	`sheet_height_mm` real NOT NULL,
	`border_left_mm` real,
	`border_top_mm` real,
	`border_right_mm` real,
	`border_bottom_mm` real,
	`thickness_notes` text,
	`sensitivities` text DEFAULT '[]' NOT NULL,
	`client_id` text NOT NULL,
	`status` text NOT NULL,
	`location` text,
	`valuation_minor` integer,
	`valuation_currency` text,
	`valuation_date` text,
	`valuation_basis` text,
	`valuer` text,
	`version` integer DEFAULT 1 NOT NULL,
	`created_by` text,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`client_id`) REFERENCES `clients`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE UNIQUE INDEX `objects_number_uq` ON `objects` (`object_number`);--> statement-breakpoint
CREATE INDEX `objects_client_idx` ON `objects` (`client_id`,`object_number`);--> statement-breakpoint
CREATE INDEX `objects_status_idx` ON `objects` (`status`,`object_number`);--> statement-breakpoint
CREATE INDEX `objects_type_idx` ON `objects` (`object_type`,`object_number`);--> statement-breakpoint
CREATE INDEX `objects_title_idx` ON `objects` (`title`);--> statement-breakpoint
CREATE INDEX `objects_maker_idx` ON `objects` (`maker`);--> statement-breakpoint
CREATE INDEX `objects_updated_idx` ON `objects` (`updated_at`);--> statement-breakpoint
CREATE TABLE `session` (
	`id` text PRIMARY KEY NOT NULL,
	`expires_at` integer NOT NULL,
	`token` text NOT NULL,
	`ip_address` text,
	`user_agent` text,
	`user_id` text NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `session_token_unique` ON `session` (`token`);--> statement-breakpoint
CREATE INDEX `session_user_idx` ON `session` (`user_id`);--> statement-breakpoint
CREATE TABLE `studio_settings` (
	`id` integer PRIMARY KEY NOT NULL,
	`studio_name` text NOT NULL,
	`studio_address` text,
	`unit` text DEFAULT 'mm' NOT NULL,
	`vocabulary` text DEFAULT 'mount' NOT NULL,
	`paper_size` text DEFAULT 'A4' NOT NULL,
	`currency` text DEFAULT 'GBP' NOT NULL,
	`min_overlap_mm` real DEFAULT 5 NOT NULL,
	`rebate_clearance_mm` real DEFAULT 2 NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `user` (
	`id` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`email` text NOT NULL,
	`email_verified` integer DEFAULT false NOT NULL,
	`image` text,
	`role` text DEFAULT 'framer' NOT NULL,
	`client_id` text,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`client_id`) REFERENCES `clients`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE UNIQUE INDEX `user_email_unique` ON `user` (`email`);--> statement-breakpoint
CREATE TABLE `verification` (
	`id` text PRIMARY KEY NOT NULL,
	`identifier` text NOT NULL,
	`value` text NOT NULL,
	`expires_at` integer NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL
);
