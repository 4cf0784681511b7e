-- A published web version is immutable: no UPDATE or DELETE of it, and no row of its web added,
-- changed or removed. The server never tries; this guards against any other path (a script, a bug).
CREATE FUNCTION refuse_published_version_change() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF OLD.status = 'published' THEN
    RAISE EXCEPTION 'web version % is published and cannot be changed', OLD.id USING ERRCODE = 'integrity_constraint_violation';
  END IF;
  RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER web_versions_published_immutable BEFORE UPDATE OR DELETE ON web_versions FOR EACH ROW EXECUTE FUNCTION refuse_published_version_change();
--> statement-breakpoint
CREATE FUNCTION refuse_published_web_row_change() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  version text := CASE WHEN TG_OP = 'DELETE' THEN OLD.version_id ELSE NEW.version_id END;
BEGIN
  IF EXISTS (SELECT 1 FROM web_versions WHERE id = version AND status = 'published')
     OR (TG_OP = 'UPDATE' AND EXISTS (SELECT 1 FROM web_versions WHERE id = OLD.version_id AND status = 'published')) THEN
    RAISE EXCEPTION 'web version % is published: its % cannot be changed', version, TG_TABLE_NAME USING ERRCODE = 'integrity_constraint_violation';
  END IF;
  RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER version_compartments_published_immutable BEFORE INSERT OR UPDATE OR DELETE ON version_compartments FOR EACH ROW EXECUTE FUNCTION refuse_published_web_row_change();
--> statement-breakpoint
CREATE TRIGGER version_flows_published_immutable BEFORE INSERT OR UPDATE OR DELETE ON version_flows FOR EACH ROW EXECUTE FUNCTION refuse_published_web_row_change();
--> statement-breakpoint
CREATE TRIGGER version_imports_published_immutable BEFORE INSERT OR UPDATE OR DELETE ON version_imports FOR EACH ROW EXECUTE FUNCTION refuse_published_web_row_change();
--> statement-breakpoint
CREATE TRIGGER version_exports_published_immutable BEFORE INSERT OR UPDATE OR DELETE ON version_exports FOR EACH ROW EXECUTE FUNCTION refuse_published_web_row_change();
--> statement-breakpoint
CREATE TRIGGER version_respiration_published_immutable BEFORE INSERT OR UPDATE OR DELETE ON version_respiration FOR EACH ROW EXECUTE FUNCTION refuse_published_web_row_change();
