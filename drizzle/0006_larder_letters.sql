CREATE TABLE `larder_outcomes` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`household_id` int NOT NULL,
	`harvest_id` bigint unsigned NOT NULL,
	`kind` enum('used_up','lasted_longer','spoiled') NOT NULL,
	`date` date NOT NULL,
	`lost_fraction` double,
	`until` date,
	`note` varchar(500),
	`created_by` varchar(36),
	`created_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `larder_outcomes_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `letters` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`household_id` int NOT NULL,
	`user_id` varchar(36) NOT NULL,
	`month` char(7) NOT NULL,
	`status` enum('sending','sent','failed') NOT NULL,
	`claimed_by` varchar(36) NOT NULL,
	`attempts` tinyint NOT NULL DEFAULT 1,
	`error` varchar(500),
	`claimed_at` timestamp NOT NULL DEFAULT (now()),
	`sent_at` timestamp,
	CONSTRAINT `letters_id` PRIMARY KEY(`id`),
	CONSTRAINT `letters_household_month_user_uq` UNIQUE(`household_id`,`month`,`user_id`)
);
--> statement-breakpoint
ALTER TABLE `memberships` ADD `monthly_letter` boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE `larder_outcomes` ADD CONSTRAINT `larder_outcomes_household_id_households_id_fk` FOREIGN KEY (`household_id`) REFERENCES `households`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `larder_outcomes` ADD CONSTRAINT `larder_outcomes_harvest_id_harvests_id_fk` FOREIGN KEY (`harvest_id`) REFERENCES `harvests`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `larder_outcomes` ADD CONSTRAINT `larder_outcomes_created_by_user_id_fk` FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `letters` ADD CONSTRAINT `letters_household_id_households_id_fk` FOREIGN KEY (`household_id`) REFERENCES `households`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `letters` ADD CONSTRAINT `letters_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `larder_outcomes_household_harvest_idx` ON `larder_outcomes` (`household_id`,`harvest_id`);--> statement-breakpoint
UPDATE `memberships` SET `monthly_letter` = true WHERE `role` IN ('owner', 'grower');
