CREATE TABLE `gear_ports` (
	`id` text PRIMARY KEY NOT NULL,
	`gear_item_id` text NOT NULL,
	`position` integer NOT NULL,
	`basis` text DEFAULT 'claimed' NOT NULL,
	`kind` text NOT NULL,
	`direction` text NOT NULL,
	`volts` real,
	`amps` real,
	`watts` real,
	`pd_profiles` text,
	`min_volts` real,
	`max_volts` real,
	`label` text,
	`efficiency` real,
	`claim_source` text,
	`field_test_id` text,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`gear_item_id`) REFERENCES `gear_items`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`field_test_id`) REFERENCES `field_tests`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `gear_ports_item_basis_position` ON `gear_ports` (`gear_item_id`,`basis`,`position`);--> statement-breakpoint
CREATE INDEX `gear_ports_kind_direction` ON `gear_ports` (`kind`,`direction`);--> statement-breakpoint
ALTER TABLE `spec_changes` ADD `old_text` text;--> statement-breakpoint
ALTER TABLE `spec_changes` ADD `new_text` text;