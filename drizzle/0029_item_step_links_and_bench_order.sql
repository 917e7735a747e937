ALTER TABLE "checklist_items" ADD COLUMN "step_key" uuid;--> statement-breakpoint
ALTER TABLE "practical_entries" ADD COLUMN "seq" integer;--> statement-breakpoint
ALTER TABLE "practical_hold_points" ADD COLUMN "seq" integer;--> statement-breakpoint
-- Earlier practicals: entries and hold points numbered in the order of their recorded times (the guards
-- refuse changes to signed records, so they stand aside for this one numbering only).
ALTER TABLE practical_entries DISABLE TRIGGER practical_entries_guard;--> statement-breakpoint
ALTER TABLE practical_hold_points DISABLE TRIGGER practical_hold_points_guard;--> statement-breakpoint
UPDATE practical_entries e SET seq = o.n FROM (
  SELECT id, row_number() OVER (PARTITION BY practical_id ORDER BY at, id) AS n, kind FROM (
    SELECT id, practical_id, recorded_at AS at, 'entry' AS kind FROM practical_entries
    UNION ALL SELECT id, practical_id, witnessed_at, 'hold' FROM practical_hold_points
  ) x
) o WHERE o.id = e.id AND o.kind = 'entry';--> statement-breakpoint
UPDATE practical_hold_points h SET seq = o.n FROM (
  SELECT id, row_number() OVER (PARTITION BY practical_id ORDER BY at, id) AS n, kind FROM (
    SELECT id, practical_id, recorded_at AS at, 'entry' AS kind FROM practical_entries
    UNION ALL SELECT id, practical_id, witnessed_at, 'hold' FROM practical_hold_points
  ) x
) o WHERE o.id = h.id AND o.kind = 'hold';--> statement-breakpoint
ALTER TABLE practical_entries ENABLE TRIGGER practical_entries_guard;--> statement-breakpoint
ALTER TABLE practical_hold_points ENABLE TRIGGER practical_hold_points_guard;
