CREATE TABLE `auth_events` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`kind` text NOT NULL,
	`email` text,
	`user_id` text,
	`actor_id` text,
	`detail` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `auth_events_kind` ON `auth_events` (`kind`,`created_at`);--> statement-breakpoint
CREATE TABLE `captured_emails` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`from_address` text NOT NULL,
	`to_address` text NOT NULL,
	`subject` text NOT NULL,
	`text_body` text DEFAULT '' NOT NULL,
	`html_body` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `field_test_items` (
	`field_test_id` text NOT NULL,
	`gear_item_id` text NOT NULL,
	PRIMARY KEY(`field_test_id`, `gear_item_id`),
	FOREIGN KEY (`field_test_id`) REFERENCES `field_tests`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`gear_item_id`) REFERENCES `gear_items`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `field_tests` (
	`id` text PRIMARY KEY NOT NULL,
	`owner_id` text NOT NULL,
	`kind` text NOT NULL,
	`tested_at` integer NOT NULL,
	`place_label` text DEFAULT '' NOT NULL,
	`sky` text,
	`ambient_c` real,
	`instruments` text DEFAULT '[]' NOT NULL,
	`method_notes` text DEFAULT '' NOT NULL,
	`status` text DEFAULT 'draft' NOT NULL,
	`approved_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`owner_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `field_tests_owner` ON `field_tests` (`owner_id`);--> statement-breakpoint
CREATE TABLE `gear_items` (
	`id` text PRIMARY KEY NOT NULL,
	`slug` text NOT NULL,
	`owner_id` text NOT NULL,
	`name` text NOT NULL,
	`maker` text NOT NULL,
	`category` text NOT NULL,
	`kind` text,
	`model_year` integer,
	`price_minor` integer,
	`price_currency` text,
	`price_paid_on` text,
	`notes` text DEFAULT '' NOT NULL,
	`status` text DEFAULT 'draft' NOT NULL,
	`approved_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`owner_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `gear_items_slug_unique` ON `gear_items` (`slug`);--> statement-breakpoint
CREATE INDEX `gear_items_category` ON `gear_items` (`category`,`status`);--> statement-breakpoint
CREATE INDEX `gear_items_owner` ON `gear_items` (`owner_id`);--> statement-breakpoint
CREATE TABLE `kit_entries` (
	`id` text PRIMARY KEY NOT NULL,
	`kit_id` text NOT NULL,
	`gear_item_id` text,
	`quantity` integer DEFAULT 1 NOT NULL,
	`free_name` text,
	`free_mass_g` real,
	`free_price_minor` integer,
	`free_price_currency` text,
	`free_draw_w` real,
	`position` integer DEFAULT 0 NOT NULL,
	FOREIGN KEY (`kit_id`) REFERENCES `kits`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`gear_item_id`) REFERENCES `gear_items`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `kit_entries_kit` ON `kit_entries` (`kit_id`);--> statement-breakpoint
CREATE TABLE `kits` (
	`id` text PRIMARY KEY NOT NULL,
	`owner_id` text NOT NULL,
	`name` text NOT NULL,
	`purpose` text DEFAULT '' NOT NULL,
	`trip_days` integer DEFAULT 1 NOT NULL,
	`share_token` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`owner_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `kits_share_token` ON `kits` (`share_token`);--> statement-breakpoint
CREATE INDEX `kits_owner` ON `kits` (`owner_id`);--> statement-breakpoint
CREATE TABLE `magic_link_tokens` (
	`token_hash` text PRIMARY KEY NOT NULL,
	`email` text NOT NULL,
	`expires_at` integer NOT NULL,
	`used_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE INDEX `magic_link_tokens_email` ON `magic_link_tokens` (`email`);--> statement-breakpoint
CREATE TABLE `photos` (
	`id` text PRIMARY KEY NOT NULL,
	`owner_id` text NOT NULL,
	`gear_item_id` text,
	`storage_key` text NOT NULL,
	`width` integer NOT NULL,
	`height` integer NOT NULL,
	`bytes` integer NOT NULL,
	`alt_text` text DEFAULT '' NOT NULL,
	`position` integer DEFAULT 0 NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`owner_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`gear_item_id`) REFERENCES `gear_items`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `photos_item` ON `photos` (`gear_item_id`);--> statement-breakpoint
CREATE TABLE `readings` (
	`trial_id` text NOT NULL,
	`seq` integer NOT NULL,
	`t` real NOT NULL,
	`value` real,
	`watts` real,
	`volts` real,
	`amps` real,
	PRIMARY KEY(`trial_id`, `seq`),
	FOREIGN KEY (`trial_id`) REFERENCES `trials`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `review_items` (
	`review_id` text NOT NULL,
	`gear_item_id` text NOT NULL,
	PRIMARY KEY(`review_id`, `gear_item_id`),
	FOREIGN KEY (`review_id`) REFERENCES `reviews`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`gear_item_id`) REFERENCES `gear_items`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `review_revisions` (
	`id` text PRIMARY KEY NOT NULL,
	`review_id` text NOT NULL,
	`number` integer NOT NULL,
	`title` text NOT NULL,
	`summary` text DEFAULT '' NOT NULL,
	`verdict` text DEFAULT '' NOT NULL,
	`body` text DEFAULT '' NOT NULL,
	`disclosure` text,
	`disclosure_note` text DEFAULT '' NOT NULL,
	`correction_note` text,
	`state` text DEFAULT 'draft' NOT NULL,
	`published_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`review_id`) REFERENCES `reviews`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `review_revisions_number` ON `review_revisions` (`review_id`,`number`);--> statement-breakpoint
CREATE TABLE `review_state_events` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`revision_id` text NOT NULL,
	`from_state` text,
	`to_state` text NOT NULL,
	`actor_id` text,
	`comment` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`revision_id`) REFERENCES `review_revisions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `review_state_events_revision` ON `review_state_events` (`revision_id`);--> statement-breakpoint
CREATE TABLE `reviews` (
	`id` text PRIMARY KEY NOT NULL,
	`slug` text NOT NULL,
	`author_id` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `reviews_slug_unique` ON `reviews` (`slug`);--> statement-breakpoint
CREATE TABLE `role_changes` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` text NOT NULL,
	`changed_by_id` text,
	`from_role` text NOT NULL,
	`to_role` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`changed_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE TABLE `specs` (
	`id` text PRIMARY KEY NOT NULL,
	`gear_item_id` text NOT NULL,
	`key` text NOT NULL,
	`mode` text DEFAULT '' NOT NULL,
	`basis` text NOT NULL,
	`value` real NOT NULL,
	`sd` real,
	`n` integer,
	`claim_source` text,
	`field_test_id` text,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`gear_item_id`) REFERENCES `gear_items`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`field_test_id`) REFERENCES `field_tests`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `specs_item_key_mode_basis` ON `specs` (`gear_item_id`,`key`,`mode`,`basis`);--> statement-breakpoint
CREATE TABLE `trials` (
	`id` text PRIMARY KEY NOT NULL,
	`field_test_id` text NOT NULL,
	`gear_item_id` text NOT NULL,
	`label` text DEFAULT '' NOT NULL,
	`switched_on_at` integer,
	`typed_values` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`field_test_id`) REFERENCES `field_tests`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`gear_item_id`) REFERENCES `gear_items`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `trials_field_test` ON `trials` (`field_test_id`);--> statement-breakpoint
CREATE TABLE `users` (
	`id` text PRIMARY KEY NOT NULL,
	`email` text NOT NULL,
	`name` text NOT NULL,
	`password_hash` text,
	`role` text DEFAULT 'reader' NOT NULL,
	`session_version` integer DEFAULT 1 NOT NULL,
	`disabled_at` integer,
	`is_demo` integer DEFAULT false NOT NULL,
	`unit_preference` text DEFAULT 'metric' NOT NULL,
	`email_verified_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `users_email_unique` ON `users` (`email`);