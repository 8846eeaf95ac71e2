CREATE TABLE `export_jobs` (
	`id` text PRIMARY KEY NOT NULL,
	`owner_id` text NOT NULL,
	`client_id` text NOT NULL,
	`state` text NOT NULL,
	`progress` real DEFAULT 0 NOT NULL,
	`message` text NOT NULL,
	`originals` integer DEFAULT false NOT NULL,
	`dir` text NOT NULL,
	`file` text NOT NULL,
	`filename` text NOT NULL,
	`created_at_ms` integer NOT NULL
);
--> statement-breakpoint
CREATE INDEX `export_jobs_client_idx` ON `export_jobs` (`client_id`,`state`);