CREATE TABLE `account_links` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`purpose` enum('invite','reset') NOT NULL,
	`token_hash` varchar(64) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	`used_at` datetime(3),
	CONSTRAINT `account_links_id` PRIMARY KEY(`id`),
	CONSTRAINT `account_links_hash_uq` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `known_sign_in_addresses` (
	`user_id` bigint unsigned NOT NULL,
	`address_hash` varchar(64) NOT NULL,
	`last_ok_at` datetime(3) NOT NULL,
	CONSTRAINT `known_sign_in_addresses_user_id_address_hash_pk` PRIMARY KEY(`user_id`,`address_hash`)
);
--> statement-breakpoint
CREATE TABLE `sign_in_throttle` (
	`key_hash` varchar(64) NOT NULL,
	`kind` enum('email','address','pair') NOT NULL,
	`failures` int NOT NULL DEFAULT 0,
	`last_failure_at` datetime(3) NOT NULL,
	CONSTRAINT `sign_in_throttle_key_hash` PRIMARY KEY(`key_hash`)
);
--> statement-breakpoint
CREATE TABLE `release_snapshots` (
	`test_id` bigint unsigned NOT NULL,
	`reduction_id` bigint unsigned NOT NULL,
	`body` json NOT NULL,
	`sha256` char(64) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `release_snapshots_test_id` PRIMARY KEY(`test_id`)
);
--> statement-breakpoint
CREATE TABLE `audit_chain_heads` (
	`chain_key` bigint unsigned NOT NULL,
	`last_seq` int unsigned NOT NULL DEFAULT 0,
	`last_hash` char(64) NOT NULL,
	CONSTRAINT `audit_chain_heads_chain_key` PRIMARY KEY(`chain_key`)
);
--> statement-breakpoint
ALTER TABLE `api_tokens` ADD `scopes` varchar(40) DEFAULT 'read,upload' NOT NULL;--> statement-breakpoint
ALTER TABLE `api_tokens` ADD `expires_at` datetime(3);--> statement-breakpoint
ALTER TABLE `users` ADD `session_epoch` int DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `reductions` ADD `transient_failures` int DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `reductions` ADD `not_before` datetime(3);--> statement-breakpoint
ALTER TABLE `audit_events` ADD `chain_key` bigint unsigned DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `audit_events` ADD `chain_seq` int unsigned;--> statement-breakpoint
ALTER TABLE `audit_events` ADD `prev_hash` char(64);--> statement-breakpoint
ALTER TABLE `audit_events` ADD `hash` char(64);--> statement-breakpoint
ALTER TABLE `audit_events` ADD CONSTRAINT `audit_chain_uq` UNIQUE(`chain_key`,`chain_seq`);--> statement-breakpoint
ALTER TABLE `account_links` ADD CONSTRAINT `account_links_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `known_sign_in_addresses` ADD CONSTRAINT `known_sign_in_addresses_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `release_snapshots` ADD CONSTRAINT `release_snapshots_test_id_tests_id_fk` FOREIGN KEY (`test_id`) REFERENCES `tests`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `release_snapshots` ADD CONSTRAINT `release_snapshots_reduction_id_reductions_id_fk` FOREIGN KEY (`reduction_id`) REFERENCES `reductions`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `account_links_user_idx` ON `account_links` (`user_id`);--> statement-breakpoint
CREATE INDEX `sign_in_throttle_last_idx` ON `sign_in_throttle` (`last_failure_at`);