CREATE TABLE `notification_settings` (
	`user_id` text PRIMARY KEY NOT NULL,
	`review_submitted` integer DEFAULT true NOT NULL,
	`changes_requested` integer DEFAULT true NOT NULL,
	`approved` integer DEFAULT true NOT NULL,
	`published` integer DEFAULT true NOT NULL,
	`retracted` integer DEFAULT true NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
