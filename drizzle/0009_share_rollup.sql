CREATE TABLE `harvest_groups` (
	`household_id` int NOT NULL,
	`day` date NOT NULL,
	`use` enum('fresh','stored','preserved','seed','given','sold','lost') NOT NULL,
	`spread` tinyint NOT NULL,
	`preserve_method` varchar(12) NOT NULL DEFAULT '',
	`crop_id` int NOT NULL DEFAULT 0,
	`food_id` int NOT NULL DEFAULT 0,
	`grams` double NOT NULL,
	`edible_grams` double NOT NULL,
	`entries` int NOT NULL,
	CONSTRAINT `harvest_groups_pk` PRIMARY KEY(`household_id`,`day`,`use`,`spread`,`preserve_method`,`crop_id`,`food_id`)
);
--> statement-breakpoint
CREATE TABLE `purchase_groups` (
	`household_id` int NOT NULL,
	`day` date NOT NULL,
	`spread` tinyint NOT NULL,
	`food_id` int NOT NULL,
	`grams` double NOT NULL,
	`edible_grams` double NOT NULL,
	`entries` int NOT NULL,
	CONSTRAINT `purchase_groups_pk` PRIMARY KEY(`household_id`,`day`,`spread`,`food_id`)
);
--> statement-breakpoint
CREATE TABLE `share_cache` (
	`household_id` int NOT NULL,
	`answer_key` varchar(190) NOT NULL,
	`version` varchar(64) NOT NULL,
	`reference_revision` bigint unsigned NOT NULL,
	`body` mediumtext NOT NULL,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `share_cache_household_id_answer_key_pk` PRIMARY KEY(`household_id`,`answer_key`)
);
--> statement-breakpoint
CREATE TABLE `share_versions` (
	`household_id` int NOT NULL,
	`version` varchar(64) NOT NULL,
	CONSTRAINT `share_versions_household_id` PRIMARY KEY(`household_id`)
);
--> statement-breakpoint
ALTER TABLE `datasets` ADD `revision` int DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `harvest_groups` ADD CONSTRAINT `harvest_groups_household_id_households_id_fk` FOREIGN KEY (`household_id`) REFERENCES `households`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `purchase_groups` ADD CONSTRAINT `purchase_groups_household_id_households_id_fk` FOREIGN KEY (`household_id`) REFERENCES `households`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `share_cache` ADD CONSTRAINT `share_cache_household_id_households_id_fk` FOREIGN KEY (`household_id`) REFERENCES `households`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `share_versions` ADD CONSTRAINT `share_versions_household_id_households_id_fk` FOREIGN KEY (`household_id`) REFERENCES `households`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
-- Issue 14: the share rollup is kept by triggers, so every write (API, import, a raw statement) updates it in its own transaction. Each trigger first stamps the household's share version (src/server/share-cache.ts): the statement's start to the microsecond, server and connection, the same for all rows of one statement (a no-op after the first) and never the same for two statements. Taking that row first also orders one household's writers, so two never wait on each other's group rows.
-- Adds n (1 or -1) harvests of these values to their group; a group left with no entries is deleted. The grouping is the share report's (src/server/share-rollup.ts reads it): a lot eaten by day (stored or preserved over 2 months or more) by its day, the rest by the month's first day.
CREATE PROCEDURE `share_harvest_add` (IN hh INT, IN d DATE, IN u VARCHAR(12), IN sm INT, IN pm VARCHAR(12), IN crop INT, IN food INT, IN g DOUBLE, IN eg DOUBLE, IN n INT)
BEGIN
  DECLARE k DATE DEFAULT IF(u IN ('stored', 'preserved') AND sm >= 2, d, d - INTERVAL (DAYOFMONTH(d) - 1) DAY);
  INSERT INTO `harvest_groups` (`household_id`, `day`, `use`, `spread`, `preserve_method`, `crop_id`, `food_id`, `grams`, `edible_grams`, `entries`)
    VALUES (hh, k, u, GREATEST(sm, 1), COALESCE(pm, ''), COALESCE(crop, 0), COALESCE(food, 0), n * g, n * eg, n)
    ON DUPLICATE KEY UPDATE `grams` = `grams` + VALUES(`grams`), `edible_grams` = `edible_grams` + VALUES(`edible_grams`), `entries` = `entries` + VALUES(`entries`);
  IF n < 0 THEN
    DELETE FROM `harvest_groups` WHERE `household_id` = hh AND `day` = k AND `use` = u AND `spread` = GREATEST(sm, 1) AND `preserve_method` = COALESCE(pm, '') AND `crop_id` = COALESCE(crop, 0) AND `food_id` = COALESCE(food, 0) AND `entries` <= 0;
  END IF;
END;
--> statement-breakpoint
CREATE PROCEDURE `share_purchase_add` (IN hh INT, IN d DATE, IN sm INT, IN food INT, IN g DOUBLE, IN eg DOUBLE, IN n INT)
BEGIN
  DECLARE k DATE DEFAULT IF(sm >= 2, d, d - INTERVAL (DAYOFMONTH(d) - 1) DAY);
  INSERT INTO `purchase_groups` (`household_id`, `day`, `spread`, `food_id`, `grams`, `edible_grams`, `entries`)
    VALUES (hh, k, GREATEST(sm, 1), food, n * g, n * eg, n)
    ON DUPLICATE KEY UPDATE `grams` = `grams` + VALUES(`grams`), `edible_grams` = `edible_grams` + VALUES(`edible_grams`), `entries` = `entries` + VALUES(`entries`);
  IF n < 0 THEN
    DELETE FROM `purchase_groups` WHERE `household_id` = hh AND `day` = k AND `spread` = GREATEST(sm, 1) AND `food_id` = food AND `entries` <= 0;
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `harvests_share_ai` AFTER INSERT ON `harvests` FOR EACH ROW
BEGIN
  INSERT INTO `share_versions` (`household_id`, `version`) VALUES (NEW.household_id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())) ON DUPLICATE KEY UPDATE `version` = VALUES(`version`);
  -- share_harvest_add(…, 1) written out: bulk imports insert thousands of rows.
  INSERT INTO `harvest_groups` (`household_id`, `day`, `use`, `spread`, `preserve_method`, `crop_id`, `food_id`, `grams`, `edible_grams`, `entries`)
    VALUES (NEW.household_id, IF(NEW.`use` IN ('stored', 'preserved') AND NEW.spread_months >= 2, NEW.`date`, NEW.`date` - INTERVAL (DAYOFMONTH(NEW.`date`) - 1) DAY), NEW.`use`,
            GREATEST(NEW.spread_months, 1), COALESCE(NEW.preserve_method, ''), COALESCE(NEW.crop_id, 0), COALESCE(NEW.food_id, 0), NEW.grams, NEW.edible_grams, 1)
    ON DUPLICATE KEY UPDATE `grams` = `grams` + VALUES(`grams`), `edible_grams` = `edible_grams` + VALUES(`edible_grams`), `entries` = `entries` + 1;
END;
--> statement-breakpoint
-- A lot with larder records is not in the groups (the report reads it one by one).
CREATE TRIGGER `harvests_share_bd` BEFORE DELETE ON `harvests` FOR EACH ROW
BEGIN
  INSERT INTO `share_versions` (`household_id`, `version`) VALUES (OLD.household_id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())) ON DUPLICATE KEY UPDATE `version` = VALUES(`version`);
  IF NOT EXISTS (SELECT 1 FROM `larder_outcomes` WHERE `harvest_id` = OLD.id) THEN
    CALL share_harvest_add(OLD.household_id, OLD.`date`, OLD.`use`, OLD.spread_months, OLD.preserve_method, OLD.crop_id, OLD.food_id, OLD.grams, OLD.edible_grams, -1);
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `harvests_share_au` AFTER UPDATE ON `harvests` FOR EACH ROW
BEGIN
  IF NOT (OLD.household_id <=> NEW.household_id AND OLD.`date` <=> NEW.`date` AND OLD.`use` <=> NEW.`use` AND OLD.spread_months <=> NEW.spread_months AND OLD.preserve_method <=> NEW.preserve_method
          AND OLD.crop_id <=> NEW.crop_id AND OLD.food_id <=> NEW.food_id AND OLD.grams <=> NEW.grams AND OLD.edible_grams <=> NEW.edible_grams) THEN
    INSERT INTO `share_versions` (`household_id`, `version`) VALUES (OLD.household_id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())) ON DUPLICATE KEY UPDATE `version` = VALUES(`version`);
    IF NEW.household_id <> OLD.household_id THEN INSERT INTO `share_versions` (`household_id`, `version`) VALUES (NEW.household_id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())) ON DUPLICATE KEY UPDATE `version` = VALUES(`version`); END IF;
    IF NOT EXISTS (SELECT 1 FROM `larder_outcomes` WHERE `harvest_id` = NEW.id) THEN
      CALL share_harvest_add(OLD.household_id, OLD.`date`, OLD.`use`, OLD.spread_months, OLD.preserve_method, OLD.crop_id, OLD.food_id, OLD.grams, OLD.edible_grams, -1);
      CALL share_harvest_add(NEW.household_id, NEW.`date`, NEW.`use`, NEW.spread_months, NEW.preserve_method, NEW.crop_id, NEW.food_id, NEW.grams, NEW.edible_grams, 1);
    END IF;
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `purchases_share_ai` AFTER INSERT ON `purchases` FOR EACH ROW
BEGIN
  INSERT INTO `share_versions` (`household_id`, `version`) VALUES (NEW.household_id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())) ON DUPLICATE KEY UPDATE `version` = VALUES(`version`);
  -- share_purchase_add(…, 1) written out, as for harvests.
  INSERT INTO `purchase_groups` (`household_id`, `day`, `spread`, `food_id`, `grams`, `edible_grams`, `entries`)
    VALUES (NEW.household_id, IF(NEW.spread_months >= 2, NEW.`date`, NEW.`date` - INTERVAL (DAYOFMONTH(NEW.`date`) - 1) DAY), GREATEST(NEW.spread_months, 1), NEW.food_id, NEW.grams, NEW.edible_grams, 1)
    ON DUPLICATE KEY UPDATE `grams` = `grams` + VALUES(`grams`), `edible_grams` = `edible_grams` + VALUES(`edible_grams`), `entries` = `entries` + 1;
END;
--> statement-breakpoint
CREATE TRIGGER `purchases_share_bd` BEFORE DELETE ON `purchases` FOR EACH ROW
BEGIN
  INSERT INTO `share_versions` (`household_id`, `version`) VALUES (OLD.household_id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())) ON DUPLICATE KEY UPDATE `version` = VALUES(`version`);
  CALL share_purchase_add(OLD.household_id, OLD.`date`, OLD.spread_months, OLD.food_id, OLD.grams, OLD.edible_grams, -1);
END;
--> statement-breakpoint
CREATE TRIGGER `purchases_share_au` AFTER UPDATE ON `purchases` FOR EACH ROW
BEGIN
  IF NOT (OLD.household_id <=> NEW.household_id AND OLD.`date` <=> NEW.`date` AND OLD.spread_months <=> NEW.spread_months AND OLD.food_id <=> NEW.food_id
          AND OLD.grams <=> NEW.grams AND OLD.edible_grams <=> NEW.edible_grams) THEN
    INSERT INTO `share_versions` (`household_id`, `version`) VALUES (OLD.household_id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())) ON DUPLICATE KEY UPDATE `version` = VALUES(`version`);
    IF NEW.household_id <> OLD.household_id THEN INSERT INTO `share_versions` (`household_id`, `version`) VALUES (NEW.household_id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())) ON DUPLICATE KEY UPDATE `version` = VALUES(`version`); END IF;
    CALL share_purchase_add(OLD.household_id, OLD.`date`, OLD.spread_months, OLD.food_id, OLD.grams, OLD.edible_grams, -1);
    CALL share_purchase_add(NEW.household_id, NEW.`date`, NEW.spread_months, NEW.food_id, NEW.grams, NEW.edible_grams, 1);
  END IF;
END;
--> statement-breakpoint
-- A lot's first larder record takes it out of the groups; removing its last record puts it back. (Records deleted with their harvest go by cascade, which fires no trigger: the harvest's own trigger saw them.)
CREATE TRIGGER `larder_outcomes_share_ai` AFTER INSERT ON `larder_outcomes` FOR EACH ROW
BEGIN
  INSERT INTO `share_versions` (`household_id`, `version`) VALUES (NEW.household_id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())) ON DUPLICATE KEY UPDATE `version` = VALUES(`version`);
  IF (SELECT COUNT(*) FROM `larder_outcomes` WHERE `harvest_id` = NEW.harvest_id) = 1 THEN
    BEGIN
      DECLARE hh INT; DECLARE d DATE; DECLARE u VARCHAR(12); DECLARE sm INT; DECLARE pm VARCHAR(12); DECLARE crop INT; DECLARE food INT; DECLARE g DOUBLE; DECLARE eg DOUBLE;
      SELECT household_id, `date`, `use`, spread_months, preserve_method, crop_id, food_id, grams, edible_grams INTO hh, d, u, sm, pm, crop, food, g, eg FROM `harvests` WHERE id = NEW.harvest_id;
      CALL share_harvest_add(hh, d, u, sm, pm, crop, food, g, eg, -1);
    END;
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `larder_outcomes_share_ad` AFTER DELETE ON `larder_outcomes` FOR EACH ROW
BEGIN
  INSERT INTO `share_versions` (`household_id`, `version`) VALUES (OLD.household_id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())) ON DUPLICATE KEY UPDATE `version` = VALUES(`version`);
  IF NOT EXISTS (SELECT 1 FROM `larder_outcomes` WHERE `harvest_id` = OLD.harvest_id) AND EXISTS (SELECT 1 FROM `harvests` WHERE id = OLD.harvest_id) THEN
    BEGIN
      DECLARE hh INT; DECLARE d DATE; DECLARE u VARCHAR(12); DECLARE sm INT; DECLARE pm VARCHAR(12); DECLARE crop INT; DECLARE food INT; DECLARE g DOUBLE; DECLARE eg DOUBLE;
      SELECT household_id, `date`, `use`, spread_months, preserve_method, crop_id, food_id, grams, edible_grams INTO hh, d, u, sm, pm, crop, food, g, eg FROM `harvests` WHERE id = OLD.harvest_id;
      CALL share_harvest_add(hh, d, u, sm, pm, crop, food, g, eg, 1);
    END;
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER `larder_outcomes_share_au` AFTER UPDATE ON `larder_outcomes` FOR EACH ROW INSERT INTO `share_versions` (`household_id`, `version`) VALUES (NEW.household_id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())) ON DUPLICATE KEY UPDATE `version` = VALUES(`version`);
--> statement-breakpoint
CREATE TRIGGER `crops_share_ai` AFTER INSERT ON `crops` FOR EACH ROW INSERT INTO `share_versions` (`household_id`, `version`) VALUES (NEW.household_id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())) ON DUPLICATE KEY UPDATE `version` = VALUES(`version`);
--> statement-breakpoint
CREATE TRIGGER `crops_share_au` AFTER UPDATE ON `crops` FOR EACH ROW INSERT INTO `share_versions` (`household_id`, `version`) VALUES (NEW.household_id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())) ON DUPLICATE KEY UPDATE `version` = VALUES(`version`);
--> statement-breakpoint
CREATE TRIGGER `crops_share_ad` AFTER DELETE ON `crops` FOR EACH ROW INSERT INTO `share_versions` (`household_id`, `version`) VALUES (OLD.household_id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())) ON DUPLICATE KEY UPDATE `version` = VALUES(`version`);
--> statement-breakpoint
CREATE TRIGGER `people_share_ai` AFTER INSERT ON `people` FOR EACH ROW INSERT INTO `share_versions` (`household_id`, `version`) VALUES (NEW.household_id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())) ON DUPLICATE KEY UPDATE `version` = VALUES(`version`);
--> statement-breakpoint
CREATE TRIGGER `people_share_au` AFTER UPDATE ON `people` FOR EACH ROW INSERT INTO `share_versions` (`household_id`, `version`) VALUES (NEW.household_id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())) ON DUPLICATE KEY UPDATE `version` = VALUES(`version`);
--> statement-breakpoint
CREATE TRIGGER `people_share_ad` AFTER DELETE ON `people` FOR EACH ROW INSERT INTO `share_versions` (`household_id`, `version`) VALUES (OLD.household_id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID())) ON DUPLICATE KEY UPDATE `version` = VALUES(`version`);
--> statement-breakpoint
-- The groups of the entries already there (after the triggers: a write racing the migration makes these inserts fail on a duplicate key rather than count twice).
INSERT INTO `harvest_groups` (`household_id`, `day`, `use`, `spread`, `preserve_method`, `crop_id`, `food_id`, `grams`, `edible_grams`, `entries`)
  SELECT h.household_id, IF(h.`use` IN ('stored', 'preserved') AND h.spread_months >= 2, h.`date`, h.`date` - INTERVAL (DAYOFMONTH(h.`date`) - 1) DAY) AS k, h.`use`, GREATEST(h.spread_months, 1) AS s,
         COALESCE(h.preserve_method, '') AS pm, COALESCE(h.crop_id, 0) AS c, COALESCE(h.food_id, 0) AS f, SUM(h.grams), SUM(h.edible_grams), COUNT(*)
    FROM `harvests` h WHERE NOT EXISTS (SELECT 1 FROM `larder_outcomes` o WHERE o.harvest_id = h.id)
   GROUP BY h.household_id, k, h.`use`, s, pm, c, f;
--> statement-breakpoint
INSERT INTO `purchase_groups` (`household_id`, `day`, `spread`, `food_id`, `grams`, `edible_grams`, `entries`)
  SELECT p.household_id, IF(p.spread_months >= 2, p.`date`, p.`date` - INTERVAL (DAYOFMONTH(p.`date`) - 1) DAY) AS k, GREATEST(p.spread_months, 1) AS s, p.food_id, SUM(p.grams), SUM(p.edible_grams), COUNT(*)
    FROM `purchases` p GROUP BY p.household_id, k, s, p.food_id;
--> statement-breakpoint
INSERT INTO `share_versions` (`household_id`, `version`) SELECT id, CONCAT(UNIX_TIMESTAMP(NOW(6)), '.', @@server_id, '.', CONNECTION_ID()) FROM `households`;
