ALTER TABLE `kit_entries` ADD `free_role` text;--> statement-breakpoint
ALTER TABLE `kit_entries` ADD `free_ports` text;--> statement-breakpoint
ALTER TABLE `kit_entries` ADD `free_efficiency` real;