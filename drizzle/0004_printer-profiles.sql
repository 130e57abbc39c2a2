CREATE TABLE `printer_profiles` (
	`id` int AUTO_INCREMENT NOT NULL,
	`organisation_id` int NOT NULL,
	`name` varchar(80) NOT NULL,
	`dpi` int NOT NULL,
	`bands` json NOT NULL,
	`end_margin_mm` double NOT NULL,
	`cuts_between_labels` boolean NOT NULL,
	`revision` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `printer_profiles_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `printer_profiles` ADD CONSTRAINT `printer_profiles_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `printer_profiles_org_idx` ON `printer_profiles` (`organisation_id`);