ALTER TABLE `one_time_tokens` MODIFY COLUMN `kind` enum('invite','reset','new-shop') NOT NULL;--> statement-breakpoint
ALTER TABLE `one_time_tokens` MODIFY COLUMN `shop_id` bigint unsigned;--> statement-breakpoint
ALTER TABLE `one_time_tokens` ADD `shop_name` varchar(120);