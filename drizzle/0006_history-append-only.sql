-- History is append-only: no event is ever changed or deleted through the database either.
-- (Someone who drops these triggers by hand is still caught by the hash chain: npm run verify-history.)
CREATE TRIGGER `events_no_update` BEFORE UPDATE ON `events` BEGIN
  SELECT RAISE(ABORT, 'history events cannot be changed');
END;
--> statement-breakpoint
CREATE TRIGGER `events_no_delete` BEFORE DELETE ON `events` BEGIN
  SELECT RAISE(ABORT, 'history events cannot be deleted');
END;
--> statement-breakpoint
CREATE TRIGGER `revisions_no_update` BEFORE UPDATE OF `data`, `revision`, `mounting_id` ON `mounting_revisions`
WHEN (SELECT status FROM mountings WHERE id = old.mounting_id) != 'draft'
BEGIN
  SELECT RAISE(ABORT, 'a revision of a completed mounting record cannot be changed');
END;
