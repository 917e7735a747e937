-- The application logs in as breakover_app itself (it used to log in as the owner and SET ROLE, which
-- RESET ROLE undid). So the role may log in, and has nothing beyond its grants: no superuser or other
-- attribute, no inherited rights, and membership in no other role. Only attributes that are wrong are
-- changed: an owner that is not a superuser may not touch SUPERUSER, REPLICATION or BYPASSRLS at all.
DO $$
DECLARE
  r pg_roles%ROWTYPE;
  m record;
BEGIN
  SELECT * INTO STRICT r FROM pg_roles WHERE rolname = 'breakover_app';
  IF NOT r.rolcanlogin THEN ALTER ROLE breakover_app LOGIN; END IF;
  IF r.rolinherit THEN ALTER ROLE breakover_app NOINHERIT; END IF;
  IF r.rolsuper THEN ALTER ROLE breakover_app NOSUPERUSER; END IF;
  IF r.rolcreatedb THEN ALTER ROLE breakover_app NOCREATEDB; END IF;
  IF r.rolcreaterole THEN ALTER ROLE breakover_app NOCREATEROLE; END IF;
  IF r.rolreplication THEN ALTER ROLE breakover_app NOREPLICATION; END IF;
  IF r.rolbypassrls THEN ALTER ROLE breakover_app NOBYPASSRLS; END IF;
  FOR m IN SELECT g.roleid::regrole AS granted, (SELECT quote_ident(a.rolname) FROM pg_roles a WHERE a.oid = g.grantor) AS grantor
      FROM pg_auth_members g WHERE g.member = r.oid LOOP
    EXECUTE format('REVOKE %s FROM breakover_app', m.granted) || coalesce(' GRANTED BY ' || m.grantor, '');
  END LOOP;
  IF EXISTS (SELECT 1 FROM pg_auth_members WHERE member = r.oid) THEN
    RAISE EXCEPTION 'breakover_app is still a member of another role; revoke it as a superuser and migrate again';
  END IF;
END
$$;
--> statement-breakpoint
-- Nobody but the owner creates objects in public (the default since PostgreSQL 15; older ones allowed it).
REVOKE CREATE ON SCHEMA public FROM PUBLIC;
