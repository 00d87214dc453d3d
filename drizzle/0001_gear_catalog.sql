CREATE TABLE `gear_figure_notes` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`gear_item_id` text NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`summary` text NOT NULL,
	`approved_by_id` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`gear_item_id`) REFERENCES `gear_items`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`approved_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `gear_figure_notes_item` ON `gear_figure_notes` (`gear_item_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `gear_pending_changes` (
	`gear_item_id` text PRIMARY KEY NOT NULL,
	`data` text NOT NULL,
	`author_id` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`gear_item_id`) REFERENCES `gear_items`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE TABLE `gear_ratios` (
	`gear_item_id` text NOT NULL,
	`ratio_id` text NOT NULL,
	`value` real NOT NULL,
	`unit` text NOT NULL,
	`basis` text NOT NULL,
	`currency` text,
	`higher_is_better` integer,
	`computed_at` integer NOT NULL,
	PRIMARY KEY(`gear_item_id`, `ratio_id`),
	FOREIGN KEY (`gear_item_id`) REFERENCES `gear_items`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `gear_ratios_ratio_value` ON `gear_ratios` (`ratio_id`,`value`);--> statement-breakpoint
CREATE TABLE `gear_state_events` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`gear_item_id` text NOT NULL,
	`from_state` text,
	`to_state` text NOT NULL,
	`actor_id` text,
	`comment` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`gear_item_id`) REFERENCES `gear_items`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `gear_state_events_item` ON `gear_state_events` (`gear_item_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `spec_changes` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`gear_item_id` text NOT NULL,
	`key` text NOT NULL,
	`mode` text DEFAULT '' NOT NULL,
	`basis` text NOT NULL,
	`old_value` real,
	`new_value` real,
	`old_source` text,
	`new_source` text,
	`context` text NOT NULL,
	`changed_by_id` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`gear_item_id`) REFERENCES `gear_items`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`changed_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `spec_changes_item` ON `spec_changes` (`gear_item_id`,`created_at`);--> statement-breakpoint
ALTER TABLE `gear_items` ADD `chemistry` text;--> statement-breakpoint
ALTER TABLE `gear_items` ADD `water_rating` text;