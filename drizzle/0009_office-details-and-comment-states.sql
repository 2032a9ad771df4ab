CREATE TABLE `comment_states` (
	`id` int AUTO_INCREMENT NOT NULL,
	`review_id` int NOT NULL,
	`comment_index` int NOT NULL,
	`state` enum('open','closed') NOT NULL,
	`actor_id` int NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `comment_states_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `office_details` (
	`id` int AUTO_INCREMENT NOT NULL,
	`name` varchar(160) NOT NULL,
	`logo_storage_key` varchar(200),
	`logo_mime` varchar(40),
	`logo_bytes` int,
	`logo_sha256` char(64),
	`created_by` int NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `office_details_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `reviews` ADD `office_version` int;--> statement-breakpoint
ALTER TABLE `comment_states` ADD CONSTRAINT `comment_states_review_id_reviews_id_fk` FOREIGN KEY (`review_id`) REFERENCES `reviews`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `comment_states` ADD CONSTRAINT `comment_states_actor_id_users_id_fk` FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `office_details` ADD CONSTRAINT `office_details_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `comment_states_comment_idx` ON `comment_states` (`review_id`,`comment_index`,`id`);--> statement-breakpoint
ALTER TABLE `reviews` ADD CONSTRAINT `reviews_office_version_office_details_id_fk` FOREIGN KEY (`office_version`) REFERENCES `office_details`(`id`) ON DELETE restrict ON UPDATE no action;