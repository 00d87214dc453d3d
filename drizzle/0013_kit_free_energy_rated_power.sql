ALTER TABLE `kit_entries` ADD `free_energy_wh` real;--> statement-breakpoint
ALTER TABLE `kit_entries` ADD `free_rated_w` real;