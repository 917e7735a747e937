-- (filled in by the change that makes the application log in as breakover_app)
SELECT 1;
