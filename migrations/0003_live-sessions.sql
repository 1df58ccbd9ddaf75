CREATE TABLE `live_chunks` (
	`session_id` bigint unsigned NOT NULL,
	`n` int NOT NULL,
	`bytes` int NOT NULL,
	`rows` int NOT NULL,
	`sha256` char(64) NOT NULL,
	`object_key` varchar(400) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `live_chunks_pk` PRIMARY KEY(`session_id`,`n`)
);
--> statement-breakpoint
CREATE TABLE `live_events` (
	`session_id` bigint unsigned NOT NULL,
	`ordinal` int NOT NULL,
	`type` enum('hold','warning','status','finished') NOT NULL,
	`data` json NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `live_events_pk` PRIMARY KEY(`session_id`,`ordinal`)
);
--> statement-breakpoint
CREATE TABLE `live_sessions` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`test_id` bigint unsigned NOT NULL,
	`opened_by` bigint unsigned,
	`status` enum('open','finished','abandoned') NOT NULL DEFAULT 'open',
	`open_test_id` bigint unsigned GENERATED ALWAYS AS ((case when `status` = 'open' then `test_id` else null end)) VIRTUAL,
	`plan` json NOT NULL,
	`next_chunk` int NOT NULL DEFAULT 1,
	`bytes` bigint unsigned NOT NULL DEFAULT 0,
	`rows` int NOT NULL DEFAULT 0,
	`sha256` char(64),
	`log_id` bigint unsigned,
	`reduction_id` bigint unsigned,
	`created_at` datetime(3) NOT NULL,
	`finished_at` datetime(3),
	CONSTRAINT `live_sessions_id` PRIMARY KEY(`id`),
	CONSTRAINT `live_sessions_open_uq` UNIQUE(`open_test_id`)
);
--> statement-breakpoint
CREATE TABLE `live_warning_mails` (
	`session_id` bigint unsigned NOT NULL,
	`gauge_id` varchar(60) NOT NULL,
	`code` varchar(40) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `live_warning_mails_pk` PRIMARY KEY(`session_id`,`gauge_id`,`code`)
);
--> statement-breakpoint
ALTER TABLE `live_chunks` ADD CONSTRAINT `live_chunks_session_id_live_sessions_id_fk` FOREIGN KEY (`session_id`) REFERENCES `live_sessions`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `live_events` ADD CONSTRAINT `live_events_session_id_live_sessions_id_fk` FOREIGN KEY (`session_id`) REFERENCES `live_sessions`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `live_sessions` ADD CONSTRAINT `live_sessions_test_id_tests_id_fk` FOREIGN KEY (`test_id`) REFERENCES `tests`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `live_sessions` ADD CONSTRAINT `live_sessions_opened_by_users_id_fk` FOREIGN KEY (`opened_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `live_sessions` ADD CONSTRAINT `live_sessions_log_id_log_files_id_fk` FOREIGN KEY (`log_id`) REFERENCES `log_files`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `live_sessions` ADD CONSTRAINT `live_sessions_reduction_id_reductions_id_fk` FOREIGN KEY (`reduction_id`) REFERENCES `reductions`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `live_warning_mails` ADD CONSTRAINT `live_warning_mails_session_id_live_sessions_id_fk` FOREIGN KEY (`session_id`) REFERENCES `live_sessions`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `live_sessions_test_idx` ON `live_sessions` (`test_id`);