-- The database enforces what the code promises: the audit trail is append-only (and every new
-- row carries its hash-chain place), a released test with its frozen record, released reduction,
-- signatures and dispositions cannot change, and nothing new is attached to a released test.
-- MariaDB DDL is not transactional: each trigger is its own statement.
-- Rows older than the audit chain: their chain is the test (0 for none); sealing happens in code.
UPDATE `audit_events` SET `chain_key` = COALESCE(`test_id`, 0) WHERE `hash` IS NULL;
--> statement-breakpoint
-- Tokens made before expiry existed get the default 90 days from their creation.
UPDATE `api_tokens` SET `expires_at` = `created_at` + INTERVAL 90 DAY WHERE `expires_at` IS NULL;
--> statement-breakpoint
CREATE TRIGGER `audit_events_append_only_insert` BEFORE INSERT ON `audit_events` FOR EACH ROW
BEGIN
  IF NEW.`hash` IS NULL OR NEW.`prev_hash` IS NULL OR NEW.`chain_seq` IS NULL THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_events: a new row must carry its place in the hash chain';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `audit_events_append_only_update` BEFORE UPDATE ON `audit_events` FOR EACH ROW
BEGIN
  IF OLD.`hash` IS NOT NULL OR NOT (NEW.`id` <=> OLD.`id` AND NEW.`at` <=> OLD.`at` AND NEW.`user_id` <=> OLD.`user_id` AND NEW.`actor` <=> OLD.`actor` AND NEW.`action` <=> OLD.`action` AND NEW.`test_id` <=> OLD.`test_id` AND NEW.`details` <=> OLD.`details` AND NEW.`chain_key` <=> OLD.`chain_key`) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_events is append-only: a row cannot be changed';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `audit_events_append_only_delete` BEFORE DELETE ON `audit_events` FOR EACH ROW
BEGIN
  SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_events is append-only: a row cannot be deleted';
END;
--> statement-breakpoint
CREATE TRIGGER `tests_released_update` BEFORE UPDATE ON `tests` FOR EACH ROW
BEGIN
  IF OLD.`status` = 'released' THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'tests: a released test is locked and cannot change';
  END IF;
  IF NEW.`status` = 'released' AND NOT EXISTS (SELECT 1 FROM `release_snapshots` s WHERE s.`test_id` = NEW.`id`) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'tests: a test is released only together with its frozen record';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `tests_released_delete` BEFORE DELETE ON `tests` FOR EACH ROW
BEGIN
  IF OLD.`status` = 'released' THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'tests: a released test is locked and cannot be deleted';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `release_snapshots_update` BEFORE UPDATE ON `release_snapshots` FOR EACH ROW
BEGIN
  SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'release_snapshots: a frozen record cannot change';
END;
--> statement-breakpoint
CREATE TRIGGER `release_snapshots_delete` BEFORE DELETE ON `release_snapshots` FOR EACH ROW
BEGIN
  SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'release_snapshots: a frozen record cannot be deleted';
END;
--> statement-breakpoint
CREATE TRIGGER `reductions_released_update` BEFORE UPDATE ON `reductions` FOR EACH ROW
BEGIN
  IF EXISTS (SELECT 1 FROM `release_snapshots` s WHERE s.`reduction_id` = OLD.`id`) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'reductions: the released reduction cannot change';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `reductions_released_delete` BEFORE DELETE ON `reductions` FOR EACH ROW
BEGIN
  IF EXISTS (SELECT 1 FROM `release_snapshots` s WHERE s.`reduction_id` = OLD.`id`) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'reductions: the released reduction cannot be deleted';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `gauge_results_released_update` BEFORE UPDATE ON `gauge_results` FOR EACH ROW
BEGIN
  IF EXISTS (SELECT 1 FROM `release_snapshots` s WHERE s.`reduction_id` = OLD.`reduction_id`) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'gauge_results: a result row of the released reduction cannot change';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `gauge_results_released_delete` BEFORE DELETE ON `gauge_results` FOR EACH ROW
BEGIN
  IF EXISTS (SELECT 1 FROM `release_snapshots` s WHERE s.`reduction_id` = OLD.`reduction_id`) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'gauge_results: a result row of the released reduction cannot be deleted';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `rosette_results_released_update` BEFORE UPDATE ON `rosette_results` FOR EACH ROW
BEGIN
  IF EXISTS (SELECT 1 FROM `release_snapshots` s WHERE s.`reduction_id` = OLD.`reduction_id`) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'rosette_results: a result row of the released reduction cannot change';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `rosette_results_released_delete` BEFORE DELETE ON `rosette_results` FOR EACH ROW
BEGIN
  IF EXISTS (SELECT 1 FROM `release_snapshots` s WHERE s.`reduction_id` = OLD.`reduction_id`) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'rosette_results: a result row of the released reduction cannot be deleted';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `signatures_released_insert` BEFORE INSERT ON `signatures` FOR EACH ROW
BEGIN
  IF (SELECT t.`status` FROM `tests` t WHERE t.`id` = NEW.`test_id` LOCK IN SHARE MODE) = 'released' THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'signatures: the test is released and locked';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `signatures_no_update` BEFORE UPDATE ON `signatures` FOR EACH ROW
BEGIN
  SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'signatures: a signature cannot change once made';
END;
--> statement-breakpoint
CREATE TRIGGER `signatures_no_delete` BEFORE DELETE ON `signatures` FOR EACH ROW
BEGIN
  SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'signatures: a signature cannot be deleted';
END;
--> statement-breakpoint
CREATE TRIGGER `dispositions_released_insert` BEFORE INSERT ON `dispositions` FOR EACH ROW
BEGIN
  IF (SELECT t.`status` FROM `tests` t WHERE t.`id` = NEW.`test_id` LOCK IN SHARE MODE) = 'released' THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'dispositions: the test is released and locked';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `dispositions_no_update` BEFORE UPDATE ON `dispositions` FOR EACH ROW
BEGIN
  SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'dispositions: a disposition cannot change once made';
END;
--> statement-breakpoint
CREATE TRIGGER `dispositions_no_delete` BEFORE DELETE ON `dispositions` FOR EACH ROW
BEGIN
  SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'dispositions: a disposition cannot be deleted';
END;
--> statement-breakpoint
CREATE TRIGGER `log_files_released_insert` BEFORE INSERT ON `log_files` FOR EACH ROW
BEGIN
  IF (SELECT t.`status` FROM `tests` t WHERE t.`id` = NEW.`test_id` LOCK IN SHARE MODE) = 'released' THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'log_files: the test is released and locked';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `log_files_released_update` BEFORE UPDATE ON `log_files` FOR EACH ROW
BEGIN
  IF (SELECT t.`status` FROM `tests` t WHERE t.`id` = OLD.`test_id` LOCK IN SHARE MODE) = 'released' THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'log_files: the test is released and locked';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `log_files_released_delete` BEFORE DELETE ON `log_files` FOR EACH ROW
BEGIN
  IF (SELECT t.`status` FROM `tests` t WHERE t.`id` = OLD.`test_id` LOCK IN SHARE MODE) = 'released' THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'log_files: the test is released and locked';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `gauges_released_insert` BEFORE INSERT ON `gauges` FOR EACH ROW
BEGIN
  IF (SELECT t.`status` FROM `tests` t WHERE t.`id` = NEW.`test_id` LOCK IN SHARE MODE) = 'released' THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'gauges: the test is released and locked';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `gauges_released_update` BEFORE UPDATE ON `gauges` FOR EACH ROW
BEGIN
  IF (SELECT t.`status` FROM `tests` t WHERE t.`id` = OLD.`test_id` LOCK IN SHARE MODE) = 'released' THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'gauges: the test is released and locked';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `gauges_released_delete` BEFORE DELETE ON `gauges` FOR EACH ROW
BEGIN
  IF (SELECT t.`status` FROM `tests` t WHERE t.`id` = OLD.`test_id` LOCK IN SHARE MODE) = 'released' THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'gauges: the test is released and locked';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `notes_released_insert` BEFORE INSERT ON `notes` FOR EACH ROW
BEGIN
  IF (SELECT t.`status` FROM `tests` t WHERE t.`id` = NEW.`test_id` LOCK IN SHARE MODE) = 'released' THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'notes: the test is released and locked';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `notes_released_update` BEFORE UPDATE ON `notes` FOR EACH ROW
BEGIN
  IF (SELECT t.`status` FROM `tests` t WHERE t.`id` = OLD.`test_id` LOCK IN SHARE MODE) = 'released' THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'notes: the test is released and locked';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `notes_released_delete` BEFORE DELETE ON `notes` FOR EACH ROW
BEGIN
  IF (SELECT t.`status` FROM `tests` t WHERE t.`id` = OLD.`test_id` LOCK IN SHARE MODE) = 'released' THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'notes: the test is released and locked';
  END IF;
END;
