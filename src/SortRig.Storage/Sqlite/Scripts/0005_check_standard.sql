-- SortRig precision log, schema version 5 (SQLite): the check standard. Each reading of the session's check part
-- with the control chart's verdict (one row per check, idempotent by commit_key), and the parts a check out of
-- control put under suspicion (measured since the last good check; suspect until measured again).
CREATE TABLE check_readings (
    id                INTEGER PRIMARY KEY,
    commit_key        TEXT    NOT NULL UNIQUE,
    session_id        INTEGER NOT NULL REFERENCES sessions (id),
    seq               INTEGER NOT NULL CHECK (seq >= 1),
    check_name        TEXT    NOT NULL,
    taken_at          INTEGER NOT NULL,
    value_ohms        REAL    NOT NULL,
    range_ohms        REAL    NOT NULL,
    u_standard_ohms   REAL    NOT NULL CHECK (u_standard_ohms >= 0),
    calibrated_ohms   REAL,
    centre_ohms       REAL,
    sigma_ohms        REAL,
    scale_factor      REAL    NOT NULL CHECK (scale_factor > 0),
    in_control        INTEGER NOT NULL CHECK (in_control IN (0, 1)),
    rule              TEXT    NOT NULL,
    reason            TEXT,
    after_part_number INTEGER NOT NULL CHECK (after_part_number >= 0),
    flagged_count     INTEGER NOT NULL CHECK (flagged_count >= 0),
    UNIQUE (session_id, seq)
);
CREATE INDEX ix_check_readings_name ON check_readings (check_name, taken_at);

CREATE TABLE suspect_parts (
    part_id  INTEGER PRIMARY KEY REFERENCES parts (id),
    check_id INTEGER NOT NULL REFERENCES check_readings (id)
);
CREATE INDEX ix_suspect_parts_check ON suspect_parts (check_id);
