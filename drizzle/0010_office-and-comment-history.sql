-- The office details and the states of comments only grow, like the rest of the history.
CREATE TRIGGER `office_details_no_update` BEFORE UPDATE ON `office_details` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'office_details are append-only: UPDATE refused';
--> statement-breakpoint
CREATE TRIGGER `office_details_no_delete` BEFORE DELETE ON `office_details` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'office_details are append-only: DELETE refused';
--> statement-breakpoint
CREATE TRIGGER `comment_states_no_update` BEFORE UPDATE ON `comment_states` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'comment_states are append-only: UPDATE refused';
--> statement-breakpoint
CREATE TRIGGER `comment_states_no_delete` BEFORE DELETE ON `comment_states` FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'comment_states are append-only: DELETE refused';
--> statement-breakpoint
-- A state names a comment that exists: its position lies inside the review's list of comments.
CREATE TRIGGER `comment_states_comment_check` BEFORE INSERT ON `comment_states` FOR EACH ROW
BEGIN
  DECLARE n INT DEFAULT NULL;
  SELECT JSON_LENGTH(`comments`) INTO n FROM `reviews` WHERE `id` = NEW.`review_id`;
  IF n IS NULL OR NEW.`comment_index` < 0 OR NEW.`comment_index` >= n THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'comment_states: no such comment in the review';
  END IF;
END;
