-- "As recorded then" asks which authorisations had something recorded about them after a moment that had
-- already taken effect by it: events recorded later than they took effect (lapses noted by the sweep,
-- certificate holds) and periods entered after they began (paper records). Both are few; these partial
-- indexes keep that question cheap at any size.
CREATE INDEX authorisation_events_backdated_idx ON authorisation_events (recorded_at, effective_at) WHERE recorded_at > effective_at;
--> statement-breakpoint
CREATE INDEX authorisation_periods_backdated_idx ON authorisation_periods (recorded_at, starts_at) WHERE recorded_at > starts_at;
