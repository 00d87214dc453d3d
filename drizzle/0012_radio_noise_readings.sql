CREATE TABLE `radio_noise_readings` (
	`id` text PRIMARY KEY NOT NULL,
	`field_test_id` text NOT NULL,
	`gear_item_id` text NOT NULL,
	`position` integer NOT NULL,
	`band` text NOT NULL,
	`frequency_mhz` real NOT NULL,
	`range` text NOT NULL,
	`mode` text NOT NULL,
	`bandwidth_hz` real NOT NULL,
	`antenna` text DEFAULT '' NOT NULL,
	`distance_m` real NOT NULL,
	`baseline_scale` text NOT NULL,
	`baseline_s_units` real,
	`baseline_db_over_s9` real,
	`baseline_dbm` real NOT NULL,
	`with_item_scale` text NOT NULL,
	`with_item_s_units` real,
	`with_item_db_over_s9` real,
	`with_item_dbm` real NOT NULL,
	FOREIGN KEY (`field_test_id`) REFERENCES `field_tests`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`gear_item_id`) REFERENCES `gear_items`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `radio_noise_readings_test` ON `radio_noise_readings` (`field_test_id`,`position`);--> statement-breakpoint
CREATE INDEX `radio_noise_readings_item` ON `radio_noise_readings` (`gear_item_id`);