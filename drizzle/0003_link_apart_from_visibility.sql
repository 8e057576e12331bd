-- A published read-only link is now the session's share_token alone; visibility says only
-- whether the session's team may see it. A session that was 'link' cannot tell whether its
-- owner meant the team to see it, so it becomes 'private' (the link keeps working): the
-- least access that keeps every grant its owner made explicitly.
UPDATE "sessions" SET "visibility" = 'private' WHERE "visibility" = 'link';
