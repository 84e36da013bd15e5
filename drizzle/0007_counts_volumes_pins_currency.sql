ALTER TABLE `harvests` MODIFY COLUMN `unit` enum('g','kg','oz','lb','piece','bunch','head','ml','l','cup','fl_oz','pint_us','pint_imp') NOT NULL;--> statement-breakpoint
ALTER TABLE `purchases` MODIFY COLUMN `unit` enum('g','kg','oz','lb','piece','bunch','head','ml','l','cup','fl_oz','pint_us','pint_imp') NOT NULL;--> statement-breakpoint
ALTER TABLE `staples` MODIFY COLUMN `unit` enum('g','kg','oz','lb','piece','bunch','head','ml','l','cup','fl_oz','pint_us','pint_imp') NOT NULL;--> statement-breakpoint
ALTER TABLE `crops` ADD `count_grams` double;--> statement-breakpoint
ALTER TABLE `crops` ADD `pin_rank` tinyint;--> statement-breakpoint
ALTER TABLE `harvests` ADD `weight_source` varchar(200);--> statement-breakpoint
ALTER TABLE `households` ADD `currency` char(3);--> statement-breakpoint
ALTER TABLE `purchases` ADD `weight_source` varchar(200);--> statement-breakpoint
UPDATE `households` h SET `currency` = (SELECT p.`currency` FROM `purchases` p WHERE p.`household_id` = h.`id` AND p.`currency` IS NOT NULL GROUP BY p.`currency` ORDER BY COUNT(*) DESC, p.`currency` LIMIT 1);
