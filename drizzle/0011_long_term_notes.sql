CREATE TABLE `long_term_note_state_events` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`note_id` text NOT NULL,
	`from_state` text,
	`to_state` text NOT NULL,
	`actor_id` text,
	`comment` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`note_id`) REFERENCES `long_term_notes`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `long_term_note_state_events_note` ON `long_term_note_state_events` (`note_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `long_term_notes` (
	`id` text PRIMARY KEY NOT NULL,
	`gear_item_id` text NOT NULL,
	`author_id` text NOT NULL,
	`noted_on` text NOT NULL,
	`months_in_service` integer NOT NULL,
	`kind` text NOT NULL,
	`title` text NOT NULL,
	`body` text NOT NULL,
	`status` text DEFAULT 'draft' NOT NULL,
	`approved_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`gear_item_id`) REFERENCES `gear_items`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `long_term_notes_item` ON `long_term_notes` (`gear_item_id`,`status`,`noted_on`);--> statement-breakpoint
CREATE INDEX `long_term_notes_author` ON `long_term_notes` (`author_id`);--> statement-breakpoint
CREATE INDEX `long_term_notes_status` ON `long_term_notes` (`status`);