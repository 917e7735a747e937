-- Sessions are found by the person they belong to, so a password change, a reset, a deactivation or an
-- admin's "end all sessions" can delete them in one statement.
CREATE INDEX IF NOT EXISTS "IDX_session_user" ON "session" ((sess->>'userId'));
