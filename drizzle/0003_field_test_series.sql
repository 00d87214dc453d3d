CREATE TABLE `field_test_state_events` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`field_test_id` text NOT NULL,
	`from_state` text,
	`to_state` text NOT NULL,
	`actor_id` text,
	`comment` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`field_test_id`) REFERENCES `field_tests`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `field_test_state_events_test` ON `field_test_state_events` (`field_test_id`,`created_at`);--> statement-breakpoint
ALTER TABLE `field_tests` ADD `updated_at` integer;--> statement-breakpoint
CREATE INDEX `field_tests_status` ON `field_tests` (`status`,`kind`);--> statement-breakpoint
ALTER TABLE `trials` ADD `position` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `trials` ADD `series` blob;--> statement-breakpoint
ALTER TABLE `trials` ADD `series_format` text;--> statement-breakpoint
ALTER TABLE `trials` ADD `series_length` integer;--> statement-breakpoint
ALTER TABLE `trials` ADD `series_meta` text;--> statement-breakpoint
ALTER TABLE `trials` ADD `series_notes` text DEFAULT '[]' NOT NULL;