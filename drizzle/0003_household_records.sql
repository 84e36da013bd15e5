CREATE TABLE `crops` (
	`id` int AUTO_INCREMENT NOT NULL,
	`household_id` int NOT NULL,
	`name` varchar(120) NOT NULL,
	`variety` varchar(120) NOT NULL DEFAULT '',
	`food_id` int,
	`category` enum('grain','legume','root_tuber','squash','leafy_green','fruit','nut_seed','herb','animal_product','other') NOT NULL DEFAULT 'other',
	`edible_fraction` double,
	`default_use` enum('fresh','stored','preserved','seed','given','sold','lost'),
	`default_spread_months` tinyint,
	`not_food` boolean NOT NULL DEFAULT false,
	`archived` boolean NOT NULL DEFAULT false,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `crops_id` PRIMARY KEY(`id`),
	CONSTRAINT `crops_household_name_variety_uq` UNIQUE(`household_id`,`name`,`variety`)
);
--> statement-breakpoint
CREATE TABLE `harvests` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`household_id` int NOT NULL,
	`crop_id` int,
	`food_id` int,
	`date` date NOT NULL,
	`quantity` double NOT NULL,
	`unit` enum('g','kg','oz','lb') NOT NULL,
	`grams` double NOT NULL,
	`edible_grams` double NOT NULL,
	`use` enum('fresh','stored','preserved','seed','given','sold','lost') NOT NULL,
	`spread_months` tinyint NOT NULL DEFAULT 1,
	`trimmed` boolean NOT NULL DEFAULT false,
	`note` varchar(500),
	`split_group` varchar(36),
	`created_by` varchar(36),
	`created_at` timestamp NOT NULL DEFAULT (now()),
	`updated_at` timestamp NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `harvests_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `idempotency_keys` (
	`household_id` int NOT NULL,
	`key` varchar(100) NOT NULL,
	`route` varchar(40) NOT NULL,
	`status` smallint NOT NULL,
	`response` text NOT NULL,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `idempotency_keys_household_id_key_pk` PRIMARY KEY(`household_id`,`key`)
);
--> statement-breakpoint
CREATE TABLE `people` (
	`id` int AUTO_INCREMENT NOT NULL,
	`household_id` int NOT NULL,
	`name` varchar(120) NOT NULL,
	`sex` enum('female','male') NOT NULL,
	`age_years` double,
	`birth_year` smallint,
	`height_cm` double,
	`weight_kg` double,
	`activity` enum('sedentary','low','active','very') NOT NULL DEFAULT 'low',
	`condition` enum('none','pregnancy','lactation') NOT NULL DEFAULT 'none',
	`kcal_per_day` double,
	`at_home_pct` double NOT NULL DEFAULT 100,
	`present_from` date,
	`present_to` date,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `people_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `purchases` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`household_id` int NOT NULL,
	`food_id` int NOT NULL,
	`date` date NOT NULL,
	`quantity` double NOT NULL,
	`unit` enum('g','kg','oz','lb') NOT NULL,
	`grams` double NOT NULL,
	`edible_grams` double NOT NULL,
	`price` decimal(12,2),
	`currency` varchar(3),
	`spread_months` tinyint NOT NULL DEFAULT 1,
	`trimmed` boolean NOT NULL DEFAULT false,
	`note` varchar(500),
	`created_by` varchar(36),
	`created_at` timestamp NOT NULL DEFAULT (now()),
	`updated_at` timestamp NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `purchases_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `staples` (
	`id` int AUTO_INCREMENT NOT NULL,
	`household_id` int NOT NULL,
	`food_id` int NOT NULL,
	`label` varchar(120) NOT NULL,
	`quantity` double NOT NULL,
	`unit` enum('g','kg','oz','lb') NOT NULL,
	`spread_months` tinyint NOT NULL DEFAULT 1,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `staples_id` PRIMARY KEY(`id`),
	CONSTRAINT `staples_household_food_uq` UNIQUE(`household_id`,`food_id`,`quantity`,`unit`)
);
--> statement-breakpoint
ALTER TABLE `crops` ADD CONSTRAINT `crops_household_id_households_id_fk` FOREIGN KEY (`household_id`) REFERENCES `households`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `crops` ADD CONSTRAINT `crops_food_id_foods_id_fk` FOREIGN KEY (`food_id`) REFERENCES `foods`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `harvests` ADD CONSTRAINT `harvests_household_id_households_id_fk` FOREIGN KEY (`household_id`) REFERENCES `households`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `harvests` ADD CONSTRAINT `harvests_crop_id_crops_id_fk` FOREIGN KEY (`crop_id`) REFERENCES `crops`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `harvests` ADD CONSTRAINT `harvests_food_id_foods_id_fk` FOREIGN KEY (`food_id`) REFERENCES `foods`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `harvests` ADD CONSTRAINT `harvests_created_by_user_id_fk` FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `idempotency_keys` ADD CONSTRAINT `idempotency_keys_household_id_households_id_fk` FOREIGN KEY (`household_id`) REFERENCES `households`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `people` ADD CONSTRAINT `people_household_id_households_id_fk` FOREIGN KEY (`household_id`) REFERENCES `households`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `purchases` ADD CONSTRAINT `purchases_household_id_households_id_fk` FOREIGN KEY (`household_id`) REFERENCES `households`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `purchases` ADD CONSTRAINT `purchases_food_id_foods_id_fk` FOREIGN KEY (`food_id`) REFERENCES `foods`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `purchases` ADD CONSTRAINT `purchases_created_by_user_id_fk` FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `staples` ADD CONSTRAINT `staples_household_id_households_id_fk` FOREIGN KEY (`household_id`) REFERENCES `households`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `staples` ADD CONSTRAINT `staples_food_id_foods_id_fk` FOREIGN KEY (`food_id`) REFERENCES `foods`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `harvests_household_date_idx` ON `harvests` (`household_id`,`date`);--> statement-breakpoint
CREATE INDEX `harvests_household_crop_idx` ON `harvests` (`household_id`,`crop_id`);--> statement-breakpoint
CREATE INDEX `people_household_idx` ON `people` (`household_id`);--> statement-breakpoint
CREATE INDEX `purchases_household_date_idx` ON `purchases` (`household_id`,`date`);