CREATE TABLE `fret_wires` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`shop_id` bigint unsigned NOT NULL,
	`name` varchar(80) NOT NULL,
	`crown_width_mm` double NOT NULL,
	`crown_height_mm` double NOT NULL,
	`tang_width_mm` double NOT NULL,
	`tang_depth_mm` double NOT NULL,
	`barb_width_mm` double NOT NULL,
	`stock_length_mm` double NOT NULL,
	`source` varchar(120) NOT NULL DEFAULT '',
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `fret_wires_id` PRIMARY KEY(`id`),
	CONSTRAINT `fret_wires_shop_name_uq` UNIQUE(`shop_id`,`name`)
);
--> statement-breakpoint
ALTER TABLE `fret_wires` ADD CONSTRAINT `fret_wires_shop_id_shops_id_fk` FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON DELETE cascade ON UPDATE no action;