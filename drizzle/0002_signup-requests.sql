CREATE TABLE `signup_requests` (
	`id` int AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`name` varchar(120) NOT NULL,
	`organisation_name` varchar(120) NOT NULL,
	`password_hash` varchar(100) NOT NULL,
	`token_hash` varchar(64) NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	`used_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `signup_requests_id` PRIMARY KEY(`id`),
	CONSTRAINT `signup_requests_token_unique` UNIQUE(`token_hash`)
);
