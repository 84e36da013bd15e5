CREATE TABLE `datasets` (
	`id` int AUTO_INCREMENT NOT NULL,
	`slug` varchar(40) NOT NULL,
	`name` varchar(200) NOT NULL,
	`release` varchar(80) NOT NULL,
	`publisher` varchar(200) NOT NULL,
	`licence` varchar(200) NOT NULL,
	`source_note` varchar(400) NOT NULL DEFAULT '',
	`food_count` int NOT NULL DEFAULT 0,
	`imported_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `datasets_id` PRIMARY KEY(`id`),
	CONSTRAINT `datasets_slug_uq` UNIQUE(`slug`)
);
--> statement-breakpoint
CREATE TABLE `food_nutrients` (
	`food_id` int NOT NULL,
	`nutrient_key` varchar(40) NOT NULL,
	`amount` double NOT NULL,
	CONSTRAINT `food_nutrients_food_id_nutrient_key_pk` PRIMARY KEY(`food_id`,`nutrient_key`)
);
--> statement-breakpoint
CREATE TABLE `food_weights` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`food_id` int NOT NULL,
	`seq` tinyint NOT NULL,
	`description` varchar(200) NOT NULL,
	`grams` double NOT NULL,
	CONSTRAINT `food_weights_id` PRIMARY KEY(`id`),
	CONSTRAINT `food_weights_food_seq_uq` UNIQUE(`food_id`,`seq`)
);
--> statement-breakpoint
CREATE TABLE `foods` (
	`id` int AUTO_INCREMENT NOT NULL,
	`dataset_id` int NOT NULL,
	`code` varchar(20) NOT NULL,
	`name` varchar(255) NOT NULL,
	`original_name` varchar(255) NOT NULL,
	`food_group` varchar(80) NOT NULL,
	`refuse_pct` double,
	`rawness` tinyint NOT NULL DEFAULT 5,
	`search_text` text NOT NULL,
	CONSTRAINT `foods_id` PRIMARY KEY(`id`),
	CONSTRAINT `foods_dataset_code_uq` UNIQUE(`dataset_id`,`code`)
);
--> statement-breakpoint
CREATE TABLE `nutrients` (
	`key` varchar(40) NOT NULL,
	`name` varchar(80) NOT NULL,
	`unit` varchar(8) NOT NULL,
	`nutrient_group` varchar(16) NOT NULL,
	`sort_order` smallint NOT NULL,
	CONSTRAINT `nutrients_key` PRIMARY KEY(`key`)
);
--> statement-breakpoint
ALTER TABLE `food_nutrients` ADD CONSTRAINT `food_nutrients_food_id_foods_id_fk` FOREIGN KEY (`food_id`) REFERENCES `foods`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `food_nutrients` ADD CONSTRAINT `food_nutrients_nutrient_key_nutrients_key_fk` FOREIGN KEY (`nutrient_key`) REFERENCES `nutrients`(`key`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `food_weights` ADD CONSTRAINT `food_weights_food_id_foods_id_fk` FOREIGN KEY (`food_id`) REFERENCES `foods`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `foods` ADD CONSTRAINT `foods_dataset_id_datasets_id_fk` FOREIGN KEY (`dataset_id`) REFERENCES `datasets`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `food_nutrients_key_idx` ON `food_nutrients` (`nutrient_key`);--> statement-breakpoint
CREATE INDEX `foods_code_idx` ON `foods` (`code`);--> statement-breakpoint
CREATE INDEX `foods_group_idx` ON `foods` (`food_group`);