-- Full-text search (issue 6): one FTS5 index over public text, kept right by triggers so every code path
-- (service, API, seed, a future retraction of gear) stays in sync. drizzle-kit does not model virtual tables
-- (stack.md trap 7); db/search.ts is the only reader.
--   kind 'review': the latest public revision of a review, only while that revision is published (not retracted).
--   kind 'gear':   a gear item while it has an approved (public) version; its columns are then the approved text.
-- porter stems English words ("lanterns" finds "lantern"); prefix indexes make "lant*" fast.
CREATE VIRTUAL TABLE `search_index` USING fts5(
	`kind` UNINDEXED,
	`ref_id` UNINDEXED,
	`title`,
	`summary`,
	`body`,
	tokenize = 'porter unicode61 remove_diacritics 2',
	prefix = '2 3 4'
);
--> statement-breakpoint
CREATE TRIGGER `search_review_revision_insert` AFTER INSERT ON `review_revisions`
WHEN NEW.`state` IN ('published', 'retracted')
BEGIN
	DELETE FROM `search_index` WHERE `kind` = 'review' AND `ref_id` = NEW.`review_id`;
	INSERT INTO `search_index` (`kind`, `ref_id`, `title`, `summary`, `body`)
	SELECT 'review', r.`review_id`, r.`title`, r.`summary` || char(10) || r.`verdict`, r.`body`
	FROM `review_revisions` r
	WHERE r.`review_id` = NEW.`review_id` AND r.`state` = 'published'
		AND r.`number` = (SELECT max(p.`number`) FROM `review_revisions` p WHERE p.`review_id` = NEW.`review_id` AND p.`state` IN ('published', 'retracted'));
END;
--> statement-breakpoint
CREATE TRIGGER `search_review_revision_update` AFTER UPDATE ON `review_revisions`
WHEN OLD.`state` IN ('published', 'retracted') OR NEW.`state` IN ('published', 'retracted')
BEGIN
	DELETE FROM `search_index` WHERE `kind` = 'review' AND `ref_id` IN (OLD.`review_id`, NEW.`review_id`);
	INSERT INTO `search_index` (`kind`, `ref_id`, `title`, `summary`, `body`)
	SELECT 'review', r.`review_id`, r.`title`, r.`summary` || char(10) || r.`verdict`, r.`body`
	FROM `review_revisions` r
	WHERE r.`review_id` = NEW.`review_id` AND r.`state` = 'published'
		AND r.`number` = (SELECT max(p.`number`) FROM `review_revisions` p WHERE p.`review_id` = NEW.`review_id` AND p.`state` IN ('published', 'retracted'));
END;
--> statement-breakpoint
CREATE TRIGGER `search_review_revision_delete` AFTER DELETE ON `review_revisions`
WHEN OLD.`state` IN ('published', 'retracted')
BEGIN
	DELETE FROM `search_index` WHERE `kind` = 'review' AND `ref_id` = OLD.`review_id`;
	INSERT INTO `search_index` (`kind`, `ref_id`, `title`, `summary`, `body`)
	SELECT 'review', r.`review_id`, r.`title`, r.`summary` || char(10) || r.`verdict`, r.`body`
	FROM `review_revisions` r
	WHERE r.`review_id` = OLD.`review_id` AND r.`state` = 'published'
		AND r.`number` = (SELECT max(p.`number`) FROM `review_revisions` p WHERE p.`review_id` = OLD.`review_id` AND p.`state` IN ('published', 'retracted'));
END;
--> statement-breakpoint
CREATE TRIGGER `search_review_delete` AFTER DELETE ON `reviews`
BEGIN
	DELETE FROM `search_index` WHERE `kind` = 'review' AND `ref_id` = OLD.`id`;
END;
--> statement-breakpoint
CREATE TRIGGER `search_gear_insert` AFTER INSERT ON `gear_items`
WHEN NEW.`approved_at` IS NOT NULL
BEGIN
	INSERT INTO `search_index` (`kind`, `ref_id`, `title`, `summary`, `body`)
	VALUES ('gear', NEW.`id`, NEW.`maker` || ' ' || NEW.`name`, replace(NEW.`category`, '-', ' ') || ' ' || coalesce(NEW.`kind`, ''), NEW.`notes`);
END;
--> statement-breakpoint
CREATE TRIGGER `search_gear_update` AFTER UPDATE ON `gear_items`
WHEN OLD.`approved_at` IS NOT NULL OR NEW.`approved_at` IS NOT NULL
BEGIN
	DELETE FROM `search_index` WHERE `kind` = 'gear' AND `ref_id` IN (OLD.`id`, NEW.`id`);
	INSERT INTO `search_index` (`kind`, `ref_id`, `title`, `summary`, `body`)
	SELECT 'gear', NEW.`id`, NEW.`maker` || ' ' || NEW.`name`, replace(NEW.`category`, '-', ' ') || ' ' || coalesce(NEW.`kind`, ''), NEW.`notes`
	WHERE NEW.`approved_at` IS NOT NULL;
END;
--> statement-breakpoint
CREATE TRIGGER `search_gear_delete` AFTER DELETE ON `gear_items`
WHEN OLD.`approved_at` IS NOT NULL
BEGIN
	DELETE FROM `search_index` WHERE `kind` = 'gear' AND `ref_id` = OLD.`id`;
END;
--> statement-breakpoint
INSERT INTO `search_index` (`kind`, `ref_id`, `title`, `summary`, `body`)
SELECT 'review', r.`review_id`, r.`title`, r.`summary` || char(10) || r.`verdict`, r.`body`
FROM `review_revisions` r
WHERE r.`state` = 'published'
	AND r.`number` = (SELECT max(p.`number`) FROM `review_revisions` p WHERE p.`review_id` = r.`review_id` AND p.`state` IN ('published', 'retracted'));
--> statement-breakpoint
INSERT INTO `search_index` (`kind`, `ref_id`, `title`, `summary`, `body`)
SELECT 'gear', g.`id`, g.`maker` || ' ' || g.`name`, replace(g.`category`, '-', ' ') || ' ' || coalesce(g.`kind`, ''), g.`notes`
FROM `gear_items` g
WHERE g.`approved_at` IS NOT NULL;
