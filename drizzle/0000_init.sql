CREATE TABLE `design_revisions` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`design_id` bigint unsigned NOT NULL,
	`revision` int NOT NULL,
	`data` json NOT NULL,
	`note` varchar(500) NOT NULL DEFAULT '',
	`author_id` varchar(40) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `design_revisions_id` PRIMARY KEY(`id`),
	CONSTRAINT `revisions_design_rev_uq` UNIQUE(`design_id`,`revision`)
);
--> statement-breakpoint
CREATE TABLE `designs` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`shop_id` bigint unsigned NOT NULL,
	`name` varchar(120) NOT NULL,
	`instrument_type` varchar(40) NOT NULL DEFAULT 'guitar',
	`client_name` varchar(120) NOT NULL DEFAULT '',
	`units` enum('mm','in') NOT NULL,
	`treble_scale_mm` double NOT NULL,
	`bass_scale_mm` double NOT NULL,
	`status` enum('draft','shared','approved','changes_requested') NOT NULL DEFAULT 'draft',
	`archived_at` datetime(3),
	`current_revision` int NOT NULL DEFAULT 1,
	`version` int NOT NULL DEFAULT 1,
	`created_by` varchar(40) NOT NULL,
	`updated_by` varchar(40) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `designs_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `one_time_tokens` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`kind` enum('invite','reset') NOT NULL,
	`token_hash` char(64) NOT NULL,
	`shop_id` bigint unsigned NOT NULL,
	`user_id` varchar(40),
	`email` varchar(254) NOT NULL,
	`role` enum('owner','builder','client'),
	`created_by` varchar(40),
	`expires_at` datetime NOT NULL,
	`used_at` datetime,
	`revoked_at` datetime,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `one_time_tokens_id` PRIMARY KEY(`id`),
	CONSTRAINT `tokens_hash_uq` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `proofs` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`shop_id` bigint unsigned NOT NULL,
	`design_id` bigint unsigned NOT NULL,
	`revision` int NOT NULL,
	`token_hash` char(64) NOT NULL,
	`client_name` varchar(120) NOT NULL,
	`client_email` varchar(254) NOT NULL,
	`message` text NOT NULL,
	`expires_at` datetime NOT NULL,
	`revoked_at` datetime,
	`created_by` varchar(40) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`decision` enum('approved','changes_requested'),
	`decided_at` datetime,
	`decided_name` varchar(120),
	`decision_comment` text,
	CONSTRAINT `proofs_id` PRIMARY KEY(`id`),
	CONSTRAINT `proofs_token_uq` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `sessions` (
	`id` varchar(255) NOT NULL,
	`user_id` varchar(40) NOT NULL,
	`expires_at` datetime NOT NULL,
	CONSTRAINT `sessions_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `shops` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`name` varchar(120) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `shops_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `template_checks` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`shop_id` bigint unsigned NOT NULL,
	`template_id` bigint unsigned NOT NULL,
	`checked_by` varchar(40) NOT NULL,
	`tolerance` double NOT NULL,
	`passed` boolean NOT NULL,
	`result` json NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `template_checks_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `templates` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`shop_id` bigint unsigned NOT NULL,
	`name` varchar(120) NOT NULL,
	`design_id` bigint unsigned,
	`revision` int,
	`units` enum('mm','in') NOT NULL,
	`treble_scale` double NOT NULL,
	`bass_scale` double NOT NULL,
	`frets` int NOT NULL,
	`slot_width` double NOT NULL,
	`key_width` double NOT NULL,
	`material` varchar(80) NOT NULL DEFAULT '',
	`storage_place` varchar(80) NOT NULL DEFAULT '',
	`condition` enum('in_use','worn','retired') NOT NULL DEFAULT 'in_use',
	`made_on` date,
	`last_checked_on` datetime,
	`last_check_passed` boolean,
	`notes` text NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `templates_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` varchar(40) NOT NULL,
	`shop_id` bigint unsigned NOT NULL,
	`email` varchar(254) NOT NULL,
	`display_name` varchar(120) NOT NULL,
	`password_hash` varchar(255) NOT NULL,
	`role` enum('owner','builder','client') NOT NULL,
	`preferred_units` enum('mm','in') NOT NULL DEFAULT 'mm',
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `users_id` PRIMARY KEY(`id`),
	CONSTRAINT `users_email_uq` UNIQUE(`email`)
);
--> statement-breakpoint
ALTER TABLE `design_revisions` ADD CONSTRAINT `design_revisions_design_id_designs_id_fk` FOREIGN KEY (`design_id`) REFERENCES `designs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `designs` ADD CONSTRAINT `designs_shop_id_shops_id_fk` FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `one_time_tokens` ADD CONSTRAINT `one_time_tokens_shop_id_shops_id_fk` FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `proofs` ADD CONSTRAINT `proofs_shop_id_shops_id_fk` FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `proofs` ADD CONSTRAINT `proofs_design_id_designs_id_fk` FOREIGN KEY (`design_id`) REFERENCES `designs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sessions` ADD CONSTRAINT `sessions_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `template_checks` ADD CONSTRAINT `template_checks_shop_id_shops_id_fk` FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `template_checks` ADD CONSTRAINT `template_checks_template_id_templates_id_fk` FOREIGN KEY (`template_id`) REFERENCES `templates`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `templates` ADD CONSTRAINT `templates_shop_id_shops_id_fk` FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `users` ADD CONSTRAINT `users_shop_id_shops_id_fk` FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `designs_shop_updated_idx` ON `designs` (`shop_id`,`updated_at`);--> statement-breakpoint
CREATE INDEX `designs_shop_name_idx` ON `designs` (`shop_id`,`name`);--> statement-breakpoint
CREATE INDEX `designs_shop_status_idx` ON `designs` (`shop_id`,`status`,`updated_at`);--> statement-breakpoint
CREATE INDEX `designs_shop_scale_idx` ON `designs` (`shop_id`,`treble_scale_mm`);--> statement-breakpoint
CREATE INDEX `tokens_shop_idx` ON `one_time_tokens` (`shop_id`,`kind`);--> statement-breakpoint
CREATE INDEX `proofs_design_idx` ON `proofs` (`shop_id`,`design_id`);--> statement-breakpoint
CREATE INDEX `sessions_user_idx` ON `sessions` (`user_id`);--> statement-breakpoint
CREATE INDEX `checks_template_idx` ON `template_checks` (`shop_id`,`template_id`);--> statement-breakpoint
CREATE INDEX `templates_shop_idx` ON `templates` (`shop_id`,`updated_at`);--> statement-breakpoint
CREATE INDEX `users_shop_idx` ON `users` (`shop_id`);