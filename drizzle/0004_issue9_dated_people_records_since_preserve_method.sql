ALTER TABLE `harvests` ADD `preserve_method` enum('frozen','canned','dried','fermented');--> statement-breakpoint
ALTER TABLE `households` ADD `records_since` char(7);--> statement-breakpoint
ALTER TABLE `people` ADD `birth_month` char(7);--> statement-breakpoint
ALTER TABLE `people` ADD `pregnancy_due_month` char(7);--> statement-breakpoint
ALTER TABLE `people` ADD `lactation_from` char(7);--> statement-breakpoint
ALTER TABLE `people` ADD `lactation_to` char(7);--> statement-breakpoint
ALTER TABLE `people` ADD `fed_from_household` boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE `people` ADD `diet` enum('omnivore','vegetarian') DEFAULT 'omnivore' NOT NULL;