-- A signed condition report only gains revisions: its revisions are never changed or deleted, and it never
-- goes back to being a draft, not even through the database (like mounting records, 0006).
CREATE TRIGGER `condition_revisions_no_update` BEFORE UPDATE OF `data`, `revision`, `report_id`, `correction_reason` ON `condition_revisions`
WHEN (SELECT status FROM condition_reports WHERE id = old.report_id) != 'draft'
BEGIN
  SELECT RAISE(ABORT, 'a revision of a signed condition report cannot be changed');
END;
--> statement-breakpoint
CREATE TRIGGER `condition_revisions_no_delete` BEFORE DELETE ON `condition_revisions`
WHEN (SELECT status FROM condition_reports WHERE id = old.report_id) != 'draft'
BEGIN
  SELECT RAISE(ABORT, 'a revision of a signed condition report cannot be deleted');
END;
--> statement-breakpoint
CREATE TRIGGER `condition_reports_stay_signed` BEFORE UPDATE OF `status` ON `condition_reports`
WHEN old.status = 'signed' AND new.status != 'signed'
BEGIN
  SELECT RAISE(ABORT, 'a signed condition report cannot go back to being a draft');
END;
