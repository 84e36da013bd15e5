CREATE TABLE `beds` (
	`id` int AUTO_INCREMENT NOT NULL,
	`household_id` int NOT NULL,
	`name` varchar(120) NOT NULL,
	`area_m2` double NOT NULL,
	`notes` varchar(500),
	`created_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `beds_id` PRIMARY KEY(`id`),
	CONSTRAINT `beds_household_name_uq` UNIQUE(`household_id`,`name`)
);
--> statement-breakpoint
CREATE TABLE `plantings` (
	`id` int AUTO_INCREMENT NOT NULL,
	`household_id` int NOT NULL,
	`crop_id` int NOT NULL,
	`bed_id` int,
	`area_m2` double NOT NULL,
	`season_year` smallint NOT NULL,
	`slot` enum('main','early','late') NOT NULL DEFAULT 'main',
	`sow_date` date,
	`harvest_from` date,
	`harvest_to` date,
	`notes` varchar(500),
	`from_plan` boolean NOT NULL DEFAULT false,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `plantings_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `crops` ADD `reference_key` varchar(40);--> statement-breakpoint
ALTER TABLE `harvests` ADD `planting_id` int;--> statement-breakpoint
ALTER TABLE `households` ADD `last_spring_frost` char(5);--> statement-breakpoint
ALTER TABLE `households` ADD `first_autumn_frost` char(5);--> statement-breakpoint
ALTER TABLE `beds` ADD CONSTRAINT `beds_household_id_households_id_fk` FOREIGN KEY (`household_id`) REFERENCES `households`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `plantings` ADD CONSTRAINT `plantings_household_id_households_id_fk` FOREIGN KEY (`household_id`) REFERENCES `households`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `plantings` ADD CONSTRAINT `plantings_crop_id_crops_id_fk` FOREIGN KEY (`crop_id`) REFERENCES `crops`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `plantings` ADD CONSTRAINT `plantings_bed_id_beds_id_fk` FOREIGN KEY (`bed_id`) REFERENCES `beds`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `plantings_household_season_idx` ON `plantings` (`household_id`,`season_year`);--> statement-breakpoint
CREATE INDEX `plantings_bed_idx` ON `plantings` (`bed_id`);--> statement-breakpoint
ALTER TABLE `harvests` ADD CONSTRAINT `harvests_planting_id_plantings_id_fk` FOREIGN KEY (`planting_id`) REFERENCES `plantings`(`id`) ON DELETE set null ON UPDATE no action;