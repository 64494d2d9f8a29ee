ALTER TABLE `design_revisions` DROP FOREIGN KEY `design_revisions_design_id_designs_id_fk`;--> statement-breakpoint
ALTER TABLE `proofs` DROP FOREIGN KEY `proofs_design_id_designs_id_fk`;--> statement-breakpoint
ALTER TABLE `designs` DROP FOREIGN KEY `designs_shop_id_shops_id_fk`;--> statement-breakpoint
ALTER TABLE `proofs` DROP INDEX IF EXISTS `proofs_design_id_designs_id_fk`;--> statement-breakpoint
ALTER TABLE `designs` DROP INDEX IF EXISTS `designs_shop_id_shops_id_fk`;--> statement-breakpoint
RENAME TABLE `designs` TO `boards`, `design_revisions` TO `board_revisions`;--> statement-breakpoint
ALTER TABLE `board_revisions` RENAME COLUMN `design_id` TO `board_id`;--> statement-breakpoint
ALTER TABLE `proofs` RENAME COLUMN `design_id` TO `board_id`;--> statement-breakpoint
ALTER TABLE `templates` RENAME COLUMN `design_id` TO `board_id`;--> statement-breakpoint
ALTER TABLE `board_revisions` RENAME INDEX `revisions_design_rev_uq` TO `revisions_board_rev_uq`;--> statement-breakpoint
ALTER TABLE `proofs` RENAME INDEX `proofs_design_idx` TO `proofs_board_idx`;--> statement-breakpoint
ALTER TABLE `boards` RENAME INDEX `designs_shop_updated_idx` TO `boards_shop_updated_idx`;--> statement-breakpoint
ALTER TABLE `boards` RENAME INDEX `designs_shop_name_idx` TO `boards_shop_name_idx`;--> statement-breakpoint
ALTER TABLE `boards` RENAME INDEX `designs_shop_status_idx` TO `boards_shop_status_idx`;--> statement-breakpoint
ALTER TABLE `boards` RENAME INDEX `designs_shop_scale_idx` TO `boards_shop_scale_idx`;--> statement-breakpoint
ALTER TABLE `board_revisions` ADD CONSTRAINT `board_revisions_board_id_boards_id_fk` FOREIGN KEY (`board_id`) REFERENCES `boards`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `proofs` ADD CONSTRAINT `proofs_board_id_boards_id_fk` FOREIGN KEY (`board_id`) REFERENCES `boards`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `boards` ADD CONSTRAINT `boards_shop_id_shops_id_fk` FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON DELETE cascade ON UPDATE no action;
