-- History only grows: UPDATE and DELETE are refused on the append-only tables.
CREATE TRIGGER `revisions_no_update` BEFORE UPDATE ON `revisions` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'revisions are append-only: UPDATE refused';
--> statement-breakpoint
CREATE TRIGGER `revisions_no_delete` BEFORE DELETE ON `revisions` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'revisions are append-only: DELETE refused';
--> statement-breakpoint
CREATE TRIGGER `reviews_no_update` BEFORE UPDATE ON `reviews` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'reviews are append-only: UPDATE refused';
--> statement-breakpoint
CREATE TRIGGER `reviews_no_delete` BEFORE DELETE ON `reviews` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'reviews are append-only: DELETE refused';
--> statement-breakpoint
CREATE TRIGGER `seals_no_update` BEFORE UPDATE ON `seals` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'seals are append-only: UPDATE refused';
--> statement-breakpoint
CREATE TRIGGER `seals_no_delete` BEFORE DELETE ON `seals` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'seals are append-only: DELETE refused';
--> statement-breakpoint
CREATE TRIGGER `audit_events_no_update` BEFORE UPDATE ON `audit_events` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_events are append-only: UPDATE refused';
--> statement-breakpoint
CREATE TRIGGER `audit_events_no_delete` BEFORE DELETE ON `audit_events` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_events are append-only: DELETE refused';
--> statement-breakpoint
CREATE TRIGGER `attachments_no_update` BEFORE UPDATE ON `attachments` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'attachments are append-only: UPDATE refused';
--> statement-breakpoint
CREATE TRIGGER `attachments_no_delete` BEFORE DELETE ON `attachments` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'attachments are append-only: DELETE refused';
--> statement-breakpoint
-- Each sheet's revisions are numbered 1, 2, 3... without a gap and each links to the one before.
CREATE TRIGGER `revisions_chain_check` BEFORE INSERT ON `revisions` FOR EACH ROW
BEGIN
  DECLARE last_seq INT DEFAULT 0;
  DECLARE last_hash CHAR(64) DEFAULT NULL;
  SELECT COALESCE(MAX(`seq`), 0) INTO last_seq FROM `revisions` WHERE `sheet_id` = NEW.`sheet_id`;
  IF NEW.`seq` <> last_seq + 1 THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'revisions: seq must follow the last revision of the sheet without a gap';
  END IF;
  IF last_seq > 0 THEN
    SELECT `content_hash` INTO last_hash FROM `revisions` WHERE `sheet_id` = NEW.`sheet_id` AND `seq` = last_seq;
  END IF;
  IF NOT (NEW.`prev_hash` <=> last_hash) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'revisions: prev_hash must be the content hash of the previous revision';
  END IF;
END;
--> statement-breakpoint
-- Segregation of duties in the database too: nobody approves a revision they authored.
CREATE TRIGGER `reviews_rules_check` BEFORE INSERT ON `reviews` FOR EACH ROW
BEGIN
  DECLARE rev_author INT;
  DECLARE rev_sheet INT;
  SELECT `author_id`, `sheet_id` INTO rev_author, rev_sheet FROM `revisions` WHERE `id` = NEW.`revision_id`;
  IF rev_sheet <> NEW.`sheet_id` THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'reviews: sheet_id must be the revision''s sheet';
  END IF;
  IF NEW.`decision` = 'approve' AND rev_author = NEW.`reviewer_id` THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'reviews: the author of a revision may not approve it';
  END IF;
  IF (NEW.`decision` = 'approve') <> (NEW.`contract_code` IS NOT NULL) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'reviews: an approval, and only an approval, carries a contractual code';
  END IF;
END;
--> statement-breakpoint
INSERT INTO `chain_heads` (`name`, `seq`, `hash`) VALUES ('audit', 0, NULL);
