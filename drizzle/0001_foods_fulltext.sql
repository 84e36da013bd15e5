-- Word search over food names (drizzle's schema builder has no FULLTEXT index for MySQL/MariaDB).
ALTER TABLE `foods` ADD FULLTEXT INDEX `foods_search_ft` (`search_text`);
