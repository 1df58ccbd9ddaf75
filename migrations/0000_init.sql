CREATE TABLE `api_tokens` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`name` varchar(120) NOT NULL,
	`token_hash` varchar(64) NOT NULL,
	`prefix` varchar(16) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`last_used_at` datetime(3),
	`revoked_at` datetime(3),
	CONSTRAINT `api_tokens_id` PRIMARY KEY(`id`),
	CONSTRAINT `api_tokens_hash_uq` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`name` varchar(120) NOT NULL,
	`role` enum('technician','engineer','qa','admin') NOT NULL,
	`password_hash` varchar(100) NOT NULL,
	`disabled` boolean NOT NULL DEFAULT false,
	`created_at` datetime(3) NOT NULL,
	`last_sign_in_at` datetime(3),
	CONSTRAINT `users_id` PRIMARY KEY(`id`),
	CONSTRAINT `users_email_uq` UNIQUE(`email`)
);
--> statement-breakpoint
CREATE TABLE `materials` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`name` varchar(160) NOT NULL,
	`elastic_modulus_mpa` double NOT NULL,
	`poisson_ratio` double NOT NULL,
	`yield_strength_mpa` double NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `materials_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `vessels` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`tag` varchar(60) NOT NULL,
	`name` varchar(160) NOT NULL,
	`shape` enum('cylinder','sphere') NOT NULL,
	`ends` enum('closed','open') NOT NULL DEFAULT 'closed',
	`inside_diameter_mm` double NOT NULL,
	`wall_thickness_mm` double NOT NULL,
	`length_mm` double,
	`features` json NOT NULL,
	`material_id` bigint unsigned,
	`units` enum('SI','US') NOT NULL DEFAULT 'SI',
	`created_by` bigint unsigned,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `vessels_id` PRIMARY KEY(`id`),
	CONSTRAINT `vessels_tag_uq` UNIQUE(`tag`)
);
--> statement-breakpoint
CREATE TABLE `gauges` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`test_id` bigint unsigned NOT NULL,
	`gauge_id` varchar(60) NOT NULL,
	`kind` enum('uniaxial','rosette-rectangular','rosette-delta') NOT NULL,
	`channels` json NOT NULL,
	`angle_deg` double NOT NULL,
	`gauge_factor` double NOT NULL,
	`instrument_gauge_factor` double NOT NULL,
	`transverse_sensitivity` double NOT NULL DEFAULT 0,
	`distance_to_discontinuity` double,
	`axial_position` double,
	`clock_deg` double,
	CONSTRAINT `gauges_id` PRIMARY KEY(`id`),
	CONSTRAINT `gauges_test_gauge_uq` UNIQUE(`test_id`,`gauge_id`)
);
--> statement-breakpoint
CREATE TABLE `notes` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`test_id` bigint unsigned NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`kind` enum('pressure-held','leak-seen','gauge-rezeroed','general') NOT NULL DEFAULT 'general',
	`body` text NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `notes_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `tests` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`name` varchar(200) NOT NULL,
	`vessel_id` bigint unsigned NOT NULL,
	`status` enum('draft','logging','reduced','reviewed','released') NOT NULL DEFAULT 'draft',
	`plan` json NOT NULL,
	`owner_id` bigint unsigned,
	`current_reduction_id` bigint unsigned,
	`verdict` enum('conforms','flagged','incomplete'),
	`flagged_count` int NOT NULL DEFAULT 0,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	`last_activity_at` datetime(3) NOT NULL,
	CONSTRAINT `tests_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `log_files` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`test_id` bigint unsigned NOT NULL,
	`object_key` varchar(400) NOT NULL,
	`filename` varchar(255) NOT NULL,
	`sha256` varchar(64) NOT NULL,
	`size_bytes` bigint unsigned NOT NULL,
	`rows` int,
	`time_start` double,
	`time_end` double,
	`column_map` json NOT NULL,
	`uploaded_by` bigint unsigned,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `log_files_id` PRIMARY KEY(`id`),
	CONSTRAINT `log_files_test_sha_uq` UNIQUE(`test_id`,`sha256`)
);
--> statement-breakpoint
CREATE TABLE `gauge_results` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`reduction_id` bigint unsigned NOT NULL,
	`gauge_id` varchar(64) NOT NULL,
	`channel` varchar(120) NOT NULL,
	`angle_deg` double NOT NULL,
	`measured_slope` double,
	`predicted_slope` double NOT NULL,
	`ratio` double,
	`deviation` double,
	`ci_low` double,
	`ci_high` double,
	`r_squared` double,
	`unloading_slope` double,
	`hysteresis` double,
	`zero_shift` double,
	`peak_strain` double,
	`effective_thickness` double,
	`flags` json NOT NULL,
	`outcome` varchar(20) NOT NULL,
	CONSTRAINT `gauge_results_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `reductions` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`test_id` bigint unsigned NOT NULL,
	`status` enum('queued','running','done','failed') NOT NULL DEFAULT 'queued',
	`progress` double NOT NULL DEFAULT 0,
	`lease_owner` varchar(120),
	`lease_until` datetime(3),
	`attempts` int NOT NULL DEFAULT 0,
	`max_attempts` int NOT NULL DEFAULT 3,
	`engine_version` varchar(40),
	`parameters` json NOT NULL,
	`result` json,
	`series_key` varchar(400),
	`error` text,
	`superseded` boolean NOT NULL DEFAULT false,
	`queued_by` bigint unsigned,
	`created_at` datetime(3) NOT NULL,
	`started_at` datetime(3),
	`finished_at` datetime(3),
	CONSTRAINT `reductions_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `rosette_results` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`reduction_id` bigint unsigned NOT NULL,
	`rosette_id` varchar(60) NOT NULL,
	`principal_strain_1` double NOT NULL,
	`principal_strain_2` double NOT NULL,
	`principal_angle_deg` double NOT NULL,
	`principal_stress_1` double NOT NULL,
	`principal_stress_2` double NOT NULL,
	`von_mises` double NOT NULL,
	`flags` json NOT NULL,
	CONSTRAINT `rosette_results_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `dispositions` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`test_id` bigint unsigned NOT NULL,
	`reduction_id` bigint unsigned NOT NULL,
	`gauge_id` varchar(64) NOT NULL,
	`outcome` enum('accepted','excluded','retest') NOT NULL,
	`reason` text NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `dispositions_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `share_links` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`test_id` bigint unsigned NOT NULL,
	`token_hash` varchar(64) NOT NULL,
	`email` varchar(254),
	`created_by` bigint unsigned NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	`revoked_at` datetime(3),
	`last_used_at` datetime(3),
	`use_count` int NOT NULL DEFAULT 0,
	CONSTRAINT `share_links_id` PRIMARY KEY(`id`),
	CONSTRAINT `share_links_hash_uq` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `signatures` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`test_id` bigint unsigned NOT NULL,
	`reduction_id` bigint unsigned NOT NULL,
	`kind` enum('review','release') NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`statement` text NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `signatures_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `audit_events` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`at` datetime(3) NOT NULL,
	`user_id` bigint unsigned,
	`actor` varchar(254) NOT NULL,
	`action` varchar(60) NOT NULL,
	`test_id` bigint unsigned,
	`details` json NOT NULL,
	CONSTRAINT `audit_events_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `outbox` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`to_address` varchar(254) NOT NULL,
	`subject` varchar(250) NOT NULL,
	`text_body` text NOT NULL,
	`status` enum('pending','sent','failed') NOT NULL DEFAULT 'pending',
	`attempts` int NOT NULL DEFAULT 0,
	`next_attempt_at` datetime(3) NOT NULL,
	`last_error` text,
	`test_id` bigint unsigned,
	`created_at` datetime(3) NOT NULL,
	`sent_at` datetime(3),
	CONSTRAINT `outbox_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `api_tokens` ADD CONSTRAINT `api_tokens_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `vessels` ADD CONSTRAINT `vessels_material_id_materials_id_fk` FOREIGN KEY (`material_id`) REFERENCES `materials`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `vessels` ADD CONSTRAINT `vessels_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `gauges` ADD CONSTRAINT `gauges_test_id_tests_id_fk` FOREIGN KEY (`test_id`) REFERENCES `tests`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `notes` ADD CONSTRAINT `notes_test_id_tests_id_fk` FOREIGN KEY (`test_id`) REFERENCES `tests`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `notes` ADD CONSTRAINT `notes_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tests` ADD CONSTRAINT `tests_vessel_id_vessels_id_fk` FOREIGN KEY (`vessel_id`) REFERENCES `vessels`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tests` ADD CONSTRAINT `tests_owner_id_users_id_fk` FOREIGN KEY (`owner_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `log_files` ADD CONSTRAINT `log_files_test_id_tests_id_fk` FOREIGN KEY (`test_id`) REFERENCES `tests`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `log_files` ADD CONSTRAINT `log_files_uploaded_by_users_id_fk` FOREIGN KEY (`uploaded_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `gauge_results` ADD CONSTRAINT `gauge_results_reduction_id_reductions_id_fk` FOREIGN KEY (`reduction_id`) REFERENCES `reductions`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `reductions` ADD CONSTRAINT `reductions_test_id_tests_id_fk` FOREIGN KEY (`test_id`) REFERENCES `tests`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `reductions` ADD CONSTRAINT `reductions_queued_by_users_id_fk` FOREIGN KEY (`queued_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `rosette_results` ADD CONSTRAINT `rosette_results_reduction_id_reductions_id_fk` FOREIGN KEY (`reduction_id`) REFERENCES `reductions`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `dispositions` ADD CONSTRAINT `dispositions_test_id_tests_id_fk` FOREIGN KEY (`test_id`) REFERENCES `tests`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `dispositions` ADD CONSTRAINT `dispositions_reduction_id_reductions_id_fk` FOREIGN KEY (`reduction_id`) REFERENCES `reductions`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `dispositions` ADD CONSTRAINT `dispositions_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `share_links` ADD CONSTRAINT `share_links_test_id_tests_id_fk` FOREIGN KEY (`test_id`) REFERENCES `tests`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `share_links` ADD CONSTRAINT `share_links_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `signatures` ADD CONSTRAINT `signatures_test_id_tests_id_fk` FOREIGN KEY (`test_id`) REFERENCES `tests`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `signatures` ADD CONSTRAINT `signatures_reduction_id_reductions_id_fk` FOREIGN KEY (`reduction_id`) REFERENCES `reductions`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `signatures` ADD CONSTRAINT `signatures_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `audit_events` ADD CONSTRAINT `audit_events_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `audit_events` ADD CONSTRAINT `audit_events_test_id_tests_id_fk` FOREIGN KEY (`test_id`) REFERENCES `tests`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `outbox` ADD CONSTRAINT `outbox_test_id_tests_id_fk` FOREIGN KEY (`test_id`) REFERENCES `tests`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `api_tokens_user_idx` ON `api_tokens` (`user_id`);--> statement-breakpoint
CREATE INDEX `materials_name_idx` ON `materials` (`name`);--> statement-breakpoint
CREATE INDEX `vessels_material_idx` ON `vessels` (`material_id`);--> statement-breakpoint
CREATE INDEX `notes_test_idx` ON `notes` (`test_id`);--> statement-breakpoint
CREATE INDEX `tests_vessel_idx` ON `tests` (`vessel_id`);--> statement-breakpoint
CREATE INDEX `tests_status_idx` ON `tests` (`status`);--> statement-breakpoint
CREATE INDEX `tests_activity_idx` ON `tests` (`last_activity_at`);--> statement-breakpoint
CREATE INDEX `log_files_test_idx` ON `log_files` (`test_id`);--> statement-breakpoint
CREATE INDEX `gauge_results_reduction_idx` ON `gauge_results` (`reduction_id`,`gauge_id`);--> statement-breakpoint
CREATE INDEX `reductions_queue_idx` ON `reductions` (`status`,`lease_until`);--> statement-breakpoint
CREATE INDEX `reductions_test_idx` ON `reductions` (`test_id`);--> statement-breakpoint
CREATE INDEX `rosette_results_reduction_idx` ON `rosette_results` (`reduction_id`);--> statement-breakpoint
CREATE INDEX `dispositions_test_idx` ON `dispositions` (`test_id`,`reduction_id`,`gauge_id`);--> statement-breakpoint
CREATE INDEX `share_links_test_idx` ON `share_links` (`test_id`);--> statement-breakpoint
CREATE INDEX `signatures_test_idx` ON `signatures` (`test_id`,`kind`);--> statement-breakpoint
CREATE INDEX `audit_test_idx` ON `audit_events` (`test_id`,`at`);--> statement-breakpoint
CREATE INDEX `audit_at_idx` ON `audit_events` (`at`);--> statement-breakpoint
CREATE INDEX `audit_action_idx` ON `audit_events` (`action`);--> statement-breakpoint
CREATE INDEX `outbox_due_idx` ON `outbox` (`status`,`next_attempt_at`);