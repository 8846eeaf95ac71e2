CREATE TABLE `mount_plans` (
	`id` text PRIMARY KEY NOT NULL,
	`object_id` text NOT NULL,
	`status` text DEFAULT 'draft' NOT NULL,
	`schema_version` integer NOT NULL,
	`input` text NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`created_by` text,
	`updated_by` text,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`object_id`) REFERENCES `objects`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `mount_plans_object_idx` ON `mount_plans` (`object_id`,`status`);