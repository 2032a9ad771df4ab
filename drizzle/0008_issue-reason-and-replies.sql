ALTER TABLE `revisions` ADD `failing_checks_reason` varchar(2000) DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `revisions` ADD `replies` json;