CREATE TABLE `gear_features` (
	`gear_item_id` text NOT NULL,
	`name` text NOT NULL,
	`present` integer NOT NULL,
	`detail` text,
	PRIMARY KEY(`gear_item_id`, `name`),
	FOREIGN KEY (`gear_item_id`) REFERENCES `gear_items`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `gear_features_name` ON `gear_features` (`name`,`present`);--> statement-breakpoint
ALTER TABLE `gear_items` ADD `also_serves_as` text DEFAULT '[]' NOT NULL;