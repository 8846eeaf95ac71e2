-- "Which objects used board from batch X?" matches batches case-insensitively; this index serves that lookup.
CREATE INDEX `mounting_batches_batch_nocase_idx` ON `mounting_batches` (`batch` COLLATE NOCASE);
