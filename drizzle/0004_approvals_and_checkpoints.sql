ALTER TABLE `designs` MODIFY COLUMN `status` enum('draft','shared','approved','changes_requested','changed_since_approval') NOT NULL DEFAULT 'draft';--> statement-breakpoint
ALTER TABLE `design_revisions` ADD `reason` enum('saved','created','proof','export','imported','restored','autosave') DEFAULT 'saved' NOT NULL;--> statement-breakpoint
ALTER TABLE `design_revisions` ADD `fingerprint` char(14);--> statement-breakpoint
ALTER TABLE `designs` ADD `working_data` json;--> statement-breakpoint
ALTER TABLE `designs` ADD `working_revision` int;--> statement-breakpoint
ALTER TABLE `designs` ADD `working_fingerprint` char(14);--> statement-breakpoint
ALTER TABLE `designs` ADD `approved_revision` int;--> statement-breakpoint
ALTER TABLE `designs` ADD `approved_fingerprint` char(14);--> statement-breakpoint
ALTER TABLE `proofs` ADD `fingerprint` char(14);--> statement-breakpoint
UPDATE `design_revisions` SET `reason` = CASE WHEN `revision` = 1 THEN 'created' WHEN `note` LIKE 'Restored revision %' THEN 'restored' ELSE 'autosave' END;--> statement-breakpoint
UPDATE `designs` d JOIN `design_revisions` r ON r.`design_id` = d.`id` AND r.`revision` = d.`current_revision` SET d.`working_data` = r.`data`, d.`working_revision` = d.`current_revision`;
