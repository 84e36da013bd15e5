ALTER TABLE `share_cache` ADD `context` varchar(255) DEFAULT '' NOT NULL;--> statement-breakpoint
-- Hand-written (issue 14): answers stored under the earlier key scheme are never asked for again.
DELETE FROM `share_cache`;
