-- Edited by hand after drizzle-kit generate: one ALTER, so that the new columns exist before the
-- new primary key names them, and household_id's foreign key keeps an index throughout.
ALTER TABLE `idempotency_keys`
  ADD `user_id` varchar(36) DEFAULT '' NOT NULL,
  ADD `request_hash` char(64) DEFAULT '' NOT NULL,
  DROP PRIMARY KEY,
  ADD PRIMARY KEY(`household_id`,`user_id`,`key`);
