-- The history log and its signed heads only grow, like the rows they cover; template versions too.
CREATE TRIGGER `log_leaves_no_update` BEFORE UPDATE ON `log_leaves` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'log_leaves are append-only: UPDATE refused';
--> statement-breakpoint
CREATE TRIGGER `log_leaves_no_delete` BEFORE DELETE ON `log_leaves` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'log_leaves are append-only: DELETE refused';
--> statement-breakpoint
CREATE TRIGGER `log_heads_no_update` BEFORE UPDATE ON `log_heads` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'log_heads are append-only: UPDATE refused';
--> statement-breakpoint
CREATE TRIGGER `log_heads_no_delete` BEFORE DELETE ON `log_heads` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'log_heads are append-only: DELETE refused';
--> statement-breakpoint
CREATE TRIGGER `templates_no_update` BEFORE UPDATE ON `templates` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'templates are append-only: UPDATE refused';
--> statement-breakpoint
CREATE TRIGGER `templates_no_delete` BEFORE DELETE ON `templates` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'templates are append-only: DELETE refused';
--> statement-breakpoint
-- Leaves are numbered 0, 1, 2... without a gap: each new leaf takes the next index.
CREATE TRIGGER `log_leaves_order_check` BEFORE INSERT ON `log_leaves` FOR EACH ROW
BEGIN
  DECLARE next_index BIGINT;
  SELECT COALESCE(MAX(`leaf_index`) + 1, 0) INTO next_index FROM `log_leaves`;
  IF NEW.`leaf_index` <> next_index THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'log_leaves: leaf_index must follow the last leaf without a gap';
  END IF;
END;
--> statement-breakpoint
-- A head never shrinks the log: each new head is at least as large as the last one.
CREATE TRIGGER `log_heads_order_check` BEFORE INSERT ON `log_heads` FOR EACH ROW
BEGIN
  DECLARE last_size BIGINT;
  SELECT COALESCE(MAX(`tree_size`), -1) INTO last_size FROM `log_heads`;
  IF NEW.`tree_size` <= last_size THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'log_heads: a new head must cover more leaves than the last one';
  END IF;
END;
--> statement-breakpoint
-- `log` counts the leaves and serialises appends; `log-heads` serialises the signing of heads.
INSERT INTO `chain_heads` (`name`, `seq`, `hash`) VALUES ('log', 0, NULL), ('log-heads', 0, NULL);
