ALTER TABLE `kit_entries` ADD `load_mode` text;--> statement-breakpoint
ALTER TABLE `kit_entries` ADD `hours_per_day` real;--> statement-breakpoint
ALTER TABLE `kit_entries` ADD `duty_cycle` real;--> statement-breakpoint
ALTER TABLE `kit_entries` ADD `chemistry` text;--> statement-breakpoint
ALTER TABLE `kit_entries` ADD `depth_of_discharge` real;--> statement-breakpoint
ALTER TABLE `kits` ADD `peak_sun_hours` real;--> statement-breakpoint
ALTER TABLE `kits` ADD `sky` text;--> statement-breakpoint
ALTER TABLE `kits` ADD `sky_share` real;--> statement-breakpoint
ALTER TABLE `kits` ADD `loss_fraction` real;--> statement-breakpoint
ALTER TABLE `kits` ADD `conversion_efficiency` real;