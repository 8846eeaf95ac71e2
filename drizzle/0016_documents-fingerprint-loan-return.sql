ALTER TABLE `custody_receipts` ADD `return_due` text;--> statement-breakpoint
ALTER TABLE `issued_documents` ADD `sha256` text;--> statement-breakpoint
ALTER TABLE `issued_documents` ADD `pages` integer;