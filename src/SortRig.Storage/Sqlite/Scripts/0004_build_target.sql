-- SortRig precision log, schema version 4 (SQLite): the build a session sorts toward (sort --recipe --sets), so a
-- stopped session resumes toward the same target. One row per session; the recipe's text is kept as it was read.
CREATE TABLE build_targets (
    session_id  INTEGER PRIMARY KEY REFERENCES sessions (id),
    recipe_name TEXT    NOT NULL,
    recipe_path TEXT    NOT NULL,
    recipe_yaml TEXT    NOT NULL,
    sets        INTEGER NOT NULL CHECK (sets BETWEEN 1 AND 64),
    csv_path    TEXT,
    set_at      INTEGER NOT NULL
);
