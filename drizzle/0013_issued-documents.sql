CREATE TABLE `issued_documents` (
	`id` text PRIMARY KEY NOT NULL,
	`code` text NOT NULL,
	`kind` text NOT NULL,
	`title` text NOT NULL,
	`object_id` text,
	`client_id` text,
	`paper_size` text NOT NULL,
	`issued_at` integer NOT NULL,
	`issued_by` text,
	`issued_by_name` text NOT NULL,
	FOREIGN KEY (`object_id`) REFERENCES `objects`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`client_id`) REFERENCES `clients`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE UNIQUE INDEX `issued_documents_code_unique` ON `issued_documents` (`code`);--> statement-breakpoint
CREATE INDEX `issued_object_idx` ON `issued_documents` (`object_id`,`issued_at`);--> statement-breakpoint
CREATE INDEX `issued_at_idx` ON `issued_documents` (`issued_at`);