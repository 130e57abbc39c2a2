ALTER TABLE `organisations` ADD `revision` int DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `sheet_layouts` ADD `revision` int DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `sites` ADD `revision` int DEFAULT 1 NOT NULL;