CREATE TABLE `attachments` (
	`id` int AUTO_INCREMENT NOT NULL,
	`sheet_id` int NOT NULL,
	`storage_key` varchar(200) NOT NULL,
	`filename` varchar(200) NOT NULL,
	`mime` varchar(80) NOT NULL,
	`bytes` int NOT NULL,
	`sha256` char(64) NOT NULL,
	`uploaded_by` int NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `attachments_id` PRIMARY KEY(`id`),
	CONSTRAINT `attachments_storage_key_unique` UNIQUE(`storage_key`)
);
--> statement-breakpoint
CREATE TABLE `audit_events` (
	`id` bigint AUTO_INCREMENT NOT NULL,
	`seq` bigint NOT NULL,
	`action` varchar(60) NOT NULL,
	`subject` varchar(200) NOT NULL,
	`actor_id` int,
	`address` varchar(64) NOT NULL DEFAULT '',
	`detail` json NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`prev_hash` char(64),
	`hash` char(64) NOT NULL,
	CONSTRAINT `audit_events_id` PRIMARY KEY(`id`),
	CONSTRAINT `audit_events_seq_unique` UNIQUE(`seq`),
	CONSTRAINT `audit_events_prev_hash_unique` UNIQUE(`prev_hash`)
);
--> statement-breakpoint
CREATE TABLE `chain_heads` (
	`name` varchar(32) NOT NULL,
	`seq` bigint NOT NULL,
	`hash` char(64),
	CONSTRAINT `chain_heads_name` PRIMARY KEY(`name`)
);
--> statement-breakpoint
CREATE TABLE `outbox` (
	`id` int AUTO_INCREMENT NOT NULL,
	`kind` varchar(40) NOT NULL,
	`to_addresses` text NOT NULL,
	`subject` varchar(250) NOT NULL,
	`body_text` text NOT NULL,
	`state` enum('pending','sent','failed') NOT NULL DEFAULT 'pending',
	`attempts` int NOT NULL DEFAULT 0,
	`next_attempt_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`last_error` varchar(500) NOT NULL DEFAULT '',
	`sent_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `outbox_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `reviews` (
	`id` int AUTO_INCREMENT NOT NULL,
	`revision_id` int NOT NULL,
	`sheet_id` int NOT NULL,
	`decision` enum('comment','return','approve') NOT NULL,
	`contract_code` varchar(8),
	`comments` json NOT NULL,
	`reviewer_id` int NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`content_hash` char(64) NOT NULL,
	CONSTRAINT `reviews_id` PRIMARY KEY(`id`),
	CONSTRAINT `reviews_sheet_contract_code_unique` UNIQUE(`sheet_id`,`contract_code`)
);
--> statement-breakpoint
CREATE TABLE `revisions` (
	`id` int AUTO_INCREMENT NOT NULL,
	`sheet_id` int NOT NULL,
	`seq` int NOT NULL,
	`code` varchar(8) NOT NULL,
	`note` varchar(500) NOT NULL DEFAULT '',
	`inputs` json NOT NULL,
	`results` json NOT NULL,
	`template_id` int NOT NULL,
	`template_slug` varchar(80) NOT NULL,
	`template_version` int NOT NULL,
	`template_title` varchar(200) NOT NULL,
	`model` varchar(60) NOT NULL,
	`template_body` mediumtext NOT NULL,
	`engine_version` varchar(32) NOT NULL,
	`report_html` longtext NOT NULL,
	`report_sections` json NOT NULL,
	`author_id` int NOT NULL,
	`issued_at` datetime(3) NOT NULL,
	`content_hash` char(64) NOT NULL,
	`prev_hash` char(64),
	CONSTRAINT `revisions_id` PRIMARY KEY(`id`),
	CONSTRAINT `revisions_sheet_seq_unique` UNIQUE(`sheet_id`,`seq`),
	CONSTRAINT `revisions_sheet_code_unique` UNIQUE(`sheet_id`,`code`),
	CONSTRAINT `revisions_content_hash_unique` UNIQUE(`content_hash`)
);
--> statement-breakpoint
CREATE TABLE `seals` (
	`id` int AUTO_INCREMENT NOT NULL,
	`revision_id` int NOT NULL,
	`archive_ref` varchar(80) NOT NULL,
	`verification_ref` varchar(24) NOT NULL,
	`storage_key` varchar(200) NOT NULL,
	`pdf_sha256` char(64) NOT NULL,
	`pdf_bytes` int NOT NULL,
	`pages` int NOT NULL,
	`sealed_by` int NOT NULL,
	`sealed_at` datetime(3) NOT NULL,
	CONSTRAINT `seals_id` PRIMARY KEY(`id`),
	CONSTRAINT `seals_revision_unique` UNIQUE(`revision_id`),
	CONSTRAINT `seals_archive_ref_unique` UNIQUE(`archive_ref`),
	CONSTRAINT `seals_verification_ref_unique` UNIQUE(`verification_ref`),
	CONSTRAINT `seals_pdf_sha256_unique` UNIQUE(`pdf_sha256`)
);
--> statement-breakpoint
ALTER TABLE `attachments` ADD CONSTRAINT `attachments_sheet_id_sheets_id_fk` FOREIGN KEY (`sheet_id`) REFERENCES `sheets`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `attachments` ADD CONSTRAINT `attachments_uploaded_by_users_id_fk` FOREIGN KEY (`uploaded_by`) REFERENCES `users`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `audit_events` ADD CONSTRAINT `audit_events_actor_id_users_id_fk` FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `reviews` ADD CONSTRAINT `reviews_revision_id_revisions_id_fk` FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `reviews` ADD CONSTRAINT `reviews_sheet_id_sheets_id_fk` FOREIGN KEY (`sheet_id`) REFERENCES `sheets`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `reviews` ADD CONSTRAINT `reviews_reviewer_id_users_id_fk` FOREIGN KEY (`reviewer_id`) REFERENCES `users`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `revisions` ADD CONSTRAINT `revisions_sheet_id_sheets_id_fk` FOREIGN KEY (`sheet_id`) REFERENCES `sheets`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `revisions` ADD CONSTRAINT `revisions_template_id_templates_id_fk` FOREIGN KEY (`template_id`) REFERENCES `templates`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `revisions` ADD CONSTRAINT `revisions_author_id_users_id_fk` FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `seals` ADD CONSTRAINT `seals_revision_id_revisions_id_fk` FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `seals` ADD CONSTRAINT `seals_sealed_by_users_id_fk` FOREIGN KEY (`sealed_by`) REFERENCES `users`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `attachments_sheet_idx` ON `attachments` (`sheet_id`);--> statement-breakpoint
CREATE INDEX `audit_events_action_idx` ON `audit_events` (`action`,`created_at`);--> statement-breakpoint
CREATE INDEX `outbox_state_idx` ON `outbox` (`state`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `reviews_revision_idx` ON `reviews` (`revision_id`);--> statement-breakpoint
CREATE INDEX `revisions_issued_idx` ON `revisions` (`issued_at`);