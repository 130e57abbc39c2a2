CREATE TABLE `board_revisions` (
	`id` int AUTO_INCREMENT NOT NULL,
	`board_id` int NOT NULL,
	`number` int NOT NULL,
	`author_id` int,
	`author_name` varchar(120) NOT NULL,
	`summary` text NOT NULL,
	`snapshot` json NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `board_revisions_id` PRIMARY KEY(`id`),
	CONSTRAINT `board_revisions_board_number` UNIQUE(`board_id`,`number`)
);
--> statement-breakpoint
CREATE TABLE `boards` (
	`id` int AUTO_INCREMENT NOT NULL,
	`organisation_id` int NOT NULL,
	`site_id` int,
	`name` varchar(120) NOT NULL,
	`location` varchar(200) NOT NULL DEFAULT '',
	`code` varchar(16) NOT NULL,
	`public_token` varchar(64) NOT NULL,
	`public_enabled` boolean NOT NULL DEFAULT true,
	`revision` int NOT NULL DEFAULT 1,
	`schedule` json NOT NULL,
	`search_text` mediumtext NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`deleted_at` datetime(3),
	CONSTRAINT `boards_id` PRIMARY KEY(`id`),
	CONSTRAINT `boards_code_unique` UNIQUE(`code`),
	CONSTRAINT `boards_token_unique` UNIQUE(`public_token`)
);
--> statement-breakpoint
CREATE TABLE `captured_mail` (
	`id` int AUTO_INCREMENT NOT NULL,
	`envelope_from` varchar(254) NOT NULL,
	`envelope_to` text NOT NULL,
	`subject` varchar(500) NOT NULL DEFAULT '',
	`raw` mediumtext NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `captured_mail_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `files` (
	`id` int AUTO_INCREMENT NOT NULL,
	`organisation_id` int NOT NULL,
	`board_id` int,
	`kind` enum('logo','photo') NOT NULL,
	`mime` varchar(40) NOT NULL,
	`size` bigint NOT NULL,
	`caption` varchar(200) NOT NULL DEFAULT '',
	`data` longblob NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `files_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `handovers` (
	`id` int AUTO_INCREMENT NOT NULL,
	`board_id` int NOT NULL,
	`user_id` int,
	`to_email` varchar(254) NOT NULL,
	`revision` int NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `handovers_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `invitations` (
	`id` int AUTO_INCREMENT NOT NULL,
	`organisation_id` int NOT NULL,
	`email` varchar(254) NOT NULL,
	`role` enum('owner','electrician','viewer') NOT NULL,
	`token_hash` varchar(64) NOT NULL,
	`invited_by` int NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	`used_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `invitations_id` PRIMARY KEY(`id`),
	CONSTRAINT `invitations_token_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `organisations` (
	`id` int AUTO_INCREMENT NOT NULL,
	`name` varchar(120) NOT NULL,
	`contact_phone` varchar(40) NOT NULL DEFAULT '',
	`contact_email` varchar(254) NOT NULL DEFAULT '',
	`print_offset_x_mm` double NOT NULL DEFAULT 0,
	`print_offset_y_mm` double NOT NULL DEFAULT 0,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `organisations_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `password_resets` (
	`id` int AUTO_INCREMENT NOT NULL,
	`user_id` int NOT NULL,
	`token_hash` varchar(64) NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	`used_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `password_resets_id` PRIMARY KEY(`id`),
	CONSTRAINT `password_resets_token_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `prints` (
	`id` int AUTO_INCREMENT NOT NULL,
	`board_id` int NOT NULL,
	`user_id` int,
	`user_name` varchar(120) NOT NULL,
	`output` varchar(32) NOT NULL,
	`media` varchar(32) NOT NULL,
	`revision` int NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `prints_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `reports` (
	`id` int AUTO_INCREMENT NOT NULL,
	`board_id` int NOT NULL,
	`message` text NOT NULL,
	`reporter_name` varchar(120) NOT NULL DEFAULT '',
	`reporter_contact` varchar(254) NOT NULL DEFAULT '',
	`status` enum('open','accepted','dismissed') NOT NULL DEFAULT 'open',
	`resolved_by` int,
	`resolved_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `reports_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `sessions` (
	`session_id` varchar(128) NOT NULL,
	`expires` int unsigned NOT NULL,
	`data` mediumtext,
	CONSTRAINT `sessions_session_id` PRIMARY KEY(`session_id`)
);
--> statement-breakpoint
CREATE TABLE `sheet_layouts` (
	`id` int AUTO_INCREMENT NOT NULL,
	`organisation_id` int NOT NULL,
	`name` varchar(80) NOT NULL,
	`page_width_mm` double NOT NULL,
	`page_height_mm` double NOT NULL,
	`label_width_mm` double NOT NULL,
	`label_height_mm` double NOT NULL,
	`columns` int NOT NULL,
	`rows` int NOT NULL,
	`margin_top_mm` double NOT NULL,
	`margin_left_mm` double NOT NULL,
	`gap_x_mm` double NOT NULL DEFAULT 0,
	`gap_y_mm` double NOT NULL DEFAULT 0,
	`corner_radius_mm` double NOT NULL DEFAULT 0,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `sheet_layouts_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `sites` (
	`id` int AUTO_INCREMENT NOT NULL,
	`organisation_id` int NOT NULL,
	`reference` varchar(60) NOT NULL,
	`client_name` varchar(120) NOT NULL DEFAULT '',
	`address` text NOT NULL,
	`client_email` varchar(254) NOT NULL DEFAULT '',
	`client_phone` varchar(40) NOT NULL DEFAULT '',
	`notes` text NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `sites_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` int AUTO_INCREMENT NOT NULL,
	`organisation_id` int NOT NULL,
	`email` varchar(254) NOT NULL,
	`name` varchar(120) NOT NULL,
	`password_hash` varchar(100) NOT NULL,
	`role` enum('owner','electrician','viewer') NOT NULL,
	`disabled` boolean NOT NULL DEFAULT false,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `users_id` PRIMARY KEY(`id`),
	CONSTRAINT `users_email_unique` UNIQUE(`email`)
);
--> statement-breakpoint
ALTER TABLE `board_revisions` ADD CONSTRAINT `board_revisions_board_id_boards_id_fk` FOREIGN KEY (`board_id`) REFERENCES `boards`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `board_revisions` ADD CONSTRAINT `board_revisions_author_id_users_id_fk` FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `boards` ADD CONSTRAINT `boards_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `boards` ADD CONSTRAINT `boards_site_id_sites_id_fk` FOREIGN KEY (`site_id`) REFERENCES `sites`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `files` ADD CONSTRAINT `files_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `files` ADD CONSTRAINT `files_board_id_boards_id_fk` FOREIGN KEY (`board_id`) REFERENCES `boards`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `handovers` ADD CONSTRAINT `handovers_board_id_boards_id_fk` FOREIGN KEY (`board_id`) REFERENCES `boards`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `handovers` ADD CONSTRAINT `handovers_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `invitations` ADD CONSTRAINT `invitations_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `invitations` ADD CONSTRAINT `invitations_invited_by_users_id_fk` FOREIGN KEY (`invited_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `password_resets` ADD CONSTRAINT `password_resets_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `prints` ADD CONSTRAINT `prints_board_id_boards_id_fk` FOREIGN KEY (`board_id`) REFERENCES `boards`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `prints` ADD CONSTRAINT `prints_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `reports` ADD CONSTRAINT `reports_board_id_boards_id_fk` FOREIGN KEY (`board_id`) REFERENCES `boards`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `reports` ADD CONSTRAINT `reports_resolved_by_users_id_fk` FOREIGN KEY (`resolved_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sheet_layouts` ADD CONSTRAINT `sheet_layouts_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sites` ADD CONSTRAINT `sites_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `users` ADD CONSTRAINT `users_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `boards_org_idx` ON `boards` (`organisation_id`);--> statement-breakpoint
CREATE INDEX `files_org_idx` ON `files` (`organisation_id`);--> statement-breakpoint
CREATE INDEX `handovers_board_idx` ON `handovers` (`board_id`);--> statement-breakpoint
CREATE INDEX `prints_board_idx` ON `prints` (`board_id`);--> statement-breakpoint
CREATE INDEX `reports_board_idx` ON `reports` (`board_id`);--> statement-breakpoint
CREATE INDEX `sheet_layouts_org_idx` ON `sheet_layouts` (`organisation_id`);--> statement-breakpoint
CREATE INDEX `sites_org_idx` ON `sites` (`organisation_id`);--> statement-breakpoint
CREATE INDEX `users_org_idx` ON `users` (`organisation_id`);