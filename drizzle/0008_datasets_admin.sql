CREATE TABLE `admin_actions` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`user_id` varchar(36),
	`user_email` varchar(255) NOT NULL,
	`action` varchar(60) NOT NULL,
	`subject` varchar(255) NOT NULL,
	`detail` varchar(1000) NOT NULL DEFAULT '',
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `admin_actions_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `disabled_accounts` (
	`user_id` varchar(36) NOT NULL,
	`disabled_by` varchar(36),
	`disabled_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `disabled_accounts_user_id` PRIMARY KEY(`user_id`)
);
--> statement-breakpoint
CREATE TABLE `dataset_jobs` (
	`id` int AUTO_INCREMENT NOT NULL,
	`slug` varchar(40) NOT NULL,
	`name` varchar(200) NOT NULL,
	`release` varchar(80) NOT NULL,
	`publisher` varchar(200) NOT NULL,
	`licence` varchar(200) NOT NULL,
	`format` enum('sr_legacy','foundation'),
	`status` enum('reading','ready','failed','applying','applied','cancelled') NOT NULL,
	`phase` varchar(200) NOT NULL DEFAULT '',
	`rows_read` int NOT NULL DEFAULT 0,
	`bytes_read` bigint NOT NULL DEFAULT 0,
	`bytes_total` bigint NOT NULL DEFAULT 0,
	`food_count` int NOT NULL DEFAULT 0,
	`amount_count` int NOT NULL DEFAULT 0,
	`errors` mediumtext,
	`preview` mediumtext,
	`payload` longblob,
	`created_by` varchar(36) NOT NULL,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	`updated_at` timestamp NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `dataset_jobs_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `dataset_releases` (
	`id` int AUTO_INCREMENT NOT NULL,
	`dataset_id` int NOT NULL,
	`release` varchar(80) NOT NULL,
	`food_count` int NOT NULL,
	`amount_count` int NOT NULL,
	`imported_by` varchar(36),
	`imported_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `dataset_releases_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `households` ADD `dataset_order` varchar(400);--> statement-breakpoint
ALTER TABLE `admin_actions` ADD CONSTRAINT `admin_actions_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `disabled_accounts` ADD CONSTRAINT `disabled_accounts_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `disabled_accounts` ADD CONSTRAINT `disabled_accounts_disabled_by_user_id_fk` FOREIGN KEY (`disabled_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `dataset_releases` ADD CONSTRAINT `dataset_releases_dataset_id_datasets_id_fk` FOREIGN KEY (`dataset_id`) REFERENCES `datasets`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `admin_actions_created_idx` ON `admin_actions` (`created_at`);--> statement-breakpoint
CREATE INDEX `dataset_releases_dataset_idx` ON `dataset_releases` (`dataset_id`);