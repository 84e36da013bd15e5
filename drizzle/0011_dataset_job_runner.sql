ALTER TABLE `dataset_jobs` ADD `kind` enum('fdc_upload','builtin_load') DEFAULT 'fdc_upload' NOT NULL;--> statement-breakpoint
ALTER TABLE `dataset_jobs` ADD `runner` varchar(160);--> statement-breakpoint
ALTER TABLE `dataset_jobs` ADD `heartbeat_at` timestamp;--> statement-breakpoint
ALTER TABLE `dataset_jobs` ADD `active_slug` varchar(40);--> statement-breakpoint
ALTER TABLE `dataset_jobs` ADD CONSTRAINT `dataset_jobs_active_slug` UNIQUE(`active_slug`);