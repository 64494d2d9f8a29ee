CREATE TABLE `deposit_payments` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`shop_id` bigint unsigned NOT NULL,
	`deposit_id` bigint unsigned NOT NULL,
	`session_id` varchar(255) NOT NULL,
	`payment_intent_id` varchar(255) NOT NULL,
	`amount_minor` int unsigned NOT NULL,
	`currency` char(3) NOT NULL,
	`paid_at` datetime NOT NULL,
	`event_id` varchar(255) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `deposit_payments_id` PRIMARY KEY(`id`),
	CONSTRAINT `deposit_payments_session_uq` UNIQUE(`session_id`)
);
--> statement-breakpoint
CREATE TABLE `deposit_refunds` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`shop_id` bigint unsigned NOT NULL,
	`payment_id` bigint unsigned NOT NULL,
	`refund_id` varchar(255) NOT NULL,
	`amount_minor` int unsigned NOT NULL,
	`currency` char(3) NOT NULL,
	`status` enum('pending','succeeded','failed','canceled','requires_action') NOT NULL,
	`requested_by` varchar(40),
	`requested_at` datetime,
	`settled_at` datetime,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `deposit_refunds_id` PRIMARY KEY(`id`),
	CONSTRAINT `deposit_refunds_refund_uq` UNIQUE(`refund_id`)
);
--> statement-breakpoint
CREATE TABLE `deposits` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`shop_id` bigint unsigned NOT NULL,
	`proof_id` bigint unsigned NOT NULL,
	`amount_minor` int unsigned NOT NULL,
	`currency` char(3) NOT NULL,
	`description` varchar(200) NOT NULL DEFAULT '',
	`created_by` varchar(40) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `deposits_id` PRIMARY KEY(`id`),
	CONSTRAINT `deposits_proof_uq` UNIQUE(`proof_id`)
);
--> statement-breakpoint
CREATE TABLE `payment_events` (
	`event_id` varchar(255) NOT NULL,
	`type` varchar(100) NOT NULL,
	`received_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `payment_events_event_id` PRIMARY KEY(`event_id`)
);
--> statement-breakpoint
ALTER TABLE `shops` ADD `currency` char(3) DEFAULT 'USD' NOT NULL;--> statement-breakpoint
ALTER TABLE `deposit_payments` ADD CONSTRAINT `deposit_payments_shop_id_shops_id_fk` FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `deposit_payments` ADD CONSTRAINT `deposit_payments_deposit_id_deposits_id_fk` FOREIGN KEY (`deposit_id`) REFERENCES `deposits`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `deposit_refunds` ADD CONSTRAINT `deposit_refunds_shop_id_shops_id_fk` FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `deposit_refunds` ADD CONSTRAINT `deposit_refunds_payment_id_deposit_payments_id_fk` FOREIGN KEY (`payment_id`) REFERENCES `deposit_payments`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `deposits` ADD CONSTRAINT `deposits_shop_id_shops_id_fk` FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `deposits` ADD CONSTRAINT `deposits_proof_id_proofs_id_fk` FOREIGN KEY (`proof_id`) REFERENCES `proofs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `deposit_payments_intent_idx` ON `deposit_payments` (`payment_intent_id`);--> statement-breakpoint
CREATE INDEX `deposit_refunds_payment_idx` ON `deposit_refunds` (`payment_id`);