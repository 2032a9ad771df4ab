-- Until now every signed-in person worked on every project. Projects that exist already keep that:
-- each active non-administrator becomes a member of each of them in their account's role, so no one
-- loses work they could see yesterday; the administrator narrows membership from the people page.
INSERT INTO `project_members` (`project_id`, `user_id`, `role`, `added_by`)
SELECT `p`.`id`, `u`.`id`, `u`.`role`, `p`.`created_by`
FROM `projects` `p` CROSS JOIN `users` `u`
WHERE `u`.`role` IN ('engineer', 'checker', 'records') AND `u`.`disabled` = 0;
