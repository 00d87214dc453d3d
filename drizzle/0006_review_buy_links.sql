CREATE TABLE `review_buy_links` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`revision_id` text NOT NULL,
	`position` integer DEFAULT 0 NOT NULL,
	`label` text NOT NULL,
	`url` text NOT NULL,
	`is_affiliate` integer DEFAULT false NOT NULL,
	FOREIGN KEY (`revision_id`) REFERENCES `review_revisions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `review_buy_links_revision` ON `review_buy_links` (`revision_id`,`position`);