CREATE TABLE `projects` (
	`id` int AUTO_INCREMENT NOT NULL,
	`job_number` varchar(32) NOT NULL,
	`name` varchar(160) NOT NULL,
	`client` varchar(160) NOT NULL DEFAULT '',
	`site` varchar(200) NOT NULL DEFAULT '',
	`created_by` int NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `projects_id` PRIMARY KEY(`id`),
	CONSTRAINT `projects_job_number_unique` UNIQUE(`job_number`)
);
--> statement-breakpoint
CREATE TABLE `sheets` (
	`id` int AUTO_INCREMENT NOT NULL,
	`project_id` int NOT NULL,
	`reference` varchar(32) NOT NULL,
	`title` varchar(200) NOT NULL,
	`part_of_structure` varchar(200) NOT NULL DEFAULT '',
	`template_id` int NOT NULL,
	`inputs` json NOT NULL,
	`draft_version` int NOT NULL DEFAULT 1,
	`created_by` int NOT NULL,
	`updated_by` int NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `sheets_id` PRIMARY KEY(`id`),
	CONSTRAINT `sheets_project_reference_unique` UNIQUE(`project_id`,`reference`)
);
--> statement-breakpoint
CREATE TABLE `signin_attempts` (
	`id` bigint AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`address` varchar(64) NOT NULL,
	`success` boolean NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `signin_attempts_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `templates` (
	`id` int AUTO_INCREMENT NOT NULL,
	`slug` varchar(80) NOT NULL,
	`version` int NOT NULL,
	`title` varchar(200) NOT NULL,
	`model` varchar(60) NOT NULL,
	`body` mediumtext NOT NULL,
	`builtin` boolean NOT NULL DEFAULT false,
	`published_by` int,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `templates_id` PRIMARY KEY(`id`),
	CONSTRAINT `templates_slug_version_unique` UNIQUE(`slug`,`version`)
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` int AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`name` varchar(120) NOT NULL,
	`password_hash` varchar(255) NOT NULL,
	`role` enum('engineer','checker','records','admin') NOT NULL,
	`disabled` boolean NOT NULL DEFAULT false,
	`session_version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `users_id` PRIMARY KEY(`id`),
	CONSTRAINT `users_email_unique` UNIQUE(`email`)
);
--> statement-breakpoint
ALTER TABLE `projects` ADD CONSTRAINT `projects_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sheets` ADD CONSTRAINT `sheets_project_id_projects_id_fk` FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sheets` ADD CONSTRAINT `sheets_template_id_templates_id_fk` FOREIGN KEY (`template_id`) REFERENCES `templates`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sheets` ADD CONSTRAINT `sheets_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sheets` ADD CONSTRAINT `sheets_updated_by_users_id_fk` FOREIGN KEY (`updated_by`) REFERENCES `users`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `templates` ADD CONSTRAINT `templates_published_by_users_id_fk` FOREIGN KEY (`published_by`) REFERENCES `users`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `sheets_project_idx` ON `sheets` (`project_id`);--> statement-breakpoint
CREATE INDEX `signin_attempts_email_idx` ON `signin_attempts` (`email`,`created_at`);--> statement-breakpoint
CREATE INDEX `signin_attempts_address_idx` ON `signin_attempts` (`address`,`created_at`);