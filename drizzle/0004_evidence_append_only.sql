-- Uploaded evidence and signed pre-use checks are kept as recorded: a correction is a new row, never an edit.
REVOKE UPDATE, DELETE, TRUNCATE ON evidence FROM breakover_app;
--> statement-breakpoint
REVOKE UPDATE, DELETE, TRUNCATE ON bench_checks FROM breakover_app;
