-- Full-text search over object number, title and maker (SQLite FTS5), kept in step by triggers.
-- The object number is also indexed with its separators removed, so "2026014" finds "2026-014".
CREATE VIRTUAL TABLE `objects_fts` USING fts5(
  object_id UNINDEXED,
  object_number,
  title,
  maker,
  tokenize = "unicode61 remove_diacritics 2"
);
--> statement-breakpoint
CREATE TRIGGER `objects_fts_ai` AFTER INSERT ON `objects` BEGIN
  INSERT INTO objects_fts(object_id, object_number, title, maker)
  VALUES (new.id, new.object_number || ' ' || replace(replace(replace(new.object_number, '-', ''), '.', ''), '/', ''), new.title, coalesce(new.maker, ''));
END;
--> statement-breakpoint
CREATE TRIGGER `objects_fts_ad` AFTER DELETE ON `objects` BEGIN
  DELETE FROM objects_fts WHERE object_id = old.id;
END;
--> statement-breakpoint
CREATE TRIGGER `objects_fts_au` AFTER UPDATE OF object_number, title, maker ON `objects` BEGIN
  DELETE FROM objects_fts WHERE object_id = old.id;
  INSERT INTO objects_fts(object_id, object_number, title, maker)
  VALUES (new.id, new.object_number || ' ' || replace(replace(replace(new.object_number, '-', ''), '.', ''), '/', ''), new.title, coalesce(new.maker, ''));
END;
