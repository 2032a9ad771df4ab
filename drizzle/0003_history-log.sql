CREATE TABLE `log_heads` (
	`id` int AUTO_INCREMENT NOT NULL,
	`tree_size` bigint NOT NULL,
	`root_hash` char(64) NOT NULL,
	`signed_at` datetime(3) NOT NULL,
	`signature` varchar(100) NOT NULL,
	`key_id` char(64) NOT NULL,
	CONSTRAINT `log_heads_id` PRIMARY KEY(`id`),
	CONSTRAINT `log_heads_tree_size_unique` UNIQUE(`tree_size`)
);
--> statement-breakpoint
CREATE TABLE `log_leaves` (
	`leaf_index` bigint NOT NULL,
	`kind` enum('template','revision','review','seal','attachment','audit') NOT NULL,
	`row_id` bigint NOT NULL,
	`batch` bigint NOT NULL,
	`leaf_hash` char(64) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `log_leaves_leaf_index` PRIMARY KEY(`leaf_index`),
	CONSTRAINT `log_leaves_kind_row_unique` UNIQUE(`kind`,`row_id`)
);
--> statement-breakpoint
ALTER TABLE `seals` ADD `log_leaf_index` bigint;--> statement-breakpoint
ALTER TABLE `seals` ADD `head_tree_size` bigint;--> statement-breakpoint
ALTER TABLE `seals` ADD `head_root_hash` char(64);--> statement-breakpoint
CREATE INDEX `log_leaves_batch_idx` ON `log_leaves` (`batch`);