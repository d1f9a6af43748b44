-- SortRig precision log, schema version 1 (SQLite).
-- Times are INTEGER microseconds since 1970-01-01T00:00:00Z. Enums are stored by name.

CREATE TABLE sessions (
    id               INTEGER PRIMARY KEY,
    name             TEXT    NOT NULL,
    operator_name    TEXT,
    notes            TEXT,
    started_at       INTEGER NOT NULL,
    finished_at      INTEGER,
    next_part_number INTEGER NOT NULL DEFAULT 1 CHECK (next_part_number >= 1)
);
CREATE INDEX ix_sessions_name ON sessions (name, finished_at);

CREATE TABLE batches (
    id                  INTEGER PRIMARY KEY,
    session_id          INTEGER NOT NULL REFERENCES sessions (id),
    started_at          INTEGER NOT NULL,
    nominal_ohms        REAL    NOT NULL CHECK (nominal_ohms > 0),
    stock_tolerance_ppm REAL    NOT NULL CHECK (stock_tolerance_ppm > 0),
    match_tolerance_ppm REAL    NOT NULL CHECK (match_tolerance_ppm > 0),
    range_ohms          REAL    NOT NULL CHECK (range_ohms > 0),
    nplc                REAL    NOT NULL CHECK (nplc > 0),
    four_wire           INTEGER NOT NULL CHECK (four_wire IN (0, 1)),
    meter_family        TEXT    NOT NULL,
    meter_identity      TEXT    NOT NULL,
    recipe_name         TEXT,
    rt_from_range_ohms  REAL,
    rt_to_range_ohms    REAL,
    rt_correction_ppm   REAL,
    rt_uncertainty_ppm  REAL,
    rt_measured_at      INTEGER
);
CREATE INDEX ix_batches_session ON batches (session_id);

CREATE TABLE parts (
    id              INTEGER PRIMARY KEY,
    commit_key      TEXT    NOT NULL UNIQUE,
    session_id      INTEGER NOT NULL REFERENCES sessions (id),
    batch_id        INTEGER NOT NULL REFERENCES batches (id),
    part_number     INTEGER NOT NULL CHECK (part_number >= 1),
    nominal_ohms    REAL    NOT NULL,
    value_ohms      REAL    NOT NULL,
    deviation_ppm   REAL    NOT NULL,
    u_standard_ohms REAL    NOT NULL CHECK (u_standard_ohms >= 0),
    u_transfer_ohms REAL    NOT NULL CHECK (u_transfer_ohms >= 0),
    coverage_k      REAL    NOT NULL CHECK (coverage_k > 0),
    range_ohms      REAL    NOT NULL,
    nplc            REAL    NOT NULL,
    temperature_c   REAL,
    accepted_at     INTEGER NOT NULL,
    cup_label       TEXT,
    slot_label      TEXT,
    state           TEXT    NOT NULL CHECK (state IN ('Accepted', 'Announced', 'Unstable', 'Undone', 'Remeasured', 'RemovedEarly')),
    announced       INTEGER NOT NULL CHECK (announced IN (0, 1)),
    location        TEXT,
    library_status  TEXT    NOT NULL CHECK (library_status IN ('Available', 'Taken', 'Used', 'Retired')),
    taken_by        TEXT,
    UNIQUE (session_id, part_number)
);
CREATE INDEX ix_parts_batch ON parts (batch_id);
CREATE INDEX ix_parts_library ON parts (library_status, nominal_ohms, deviation_ppm);

CREATE TABLE raw_readings (
    part_id    INTEGER NOT NULL REFERENCES parts (id),
    seq        INTEGER NOT NULL CHECK (seq >= 0),
    taken_at   INTEGER NOT NULL,
    value_ohms REAL    NOT NULL,
    range_ohms REAL    NOT NULL,
    kind       TEXT    NOT NULL CHECK (kind IN ('Finite', 'Overload')),
    PRIMARY KEY (part_id, seq)
) WITHOUT ROWID;

CREATE TABLE part_events (
    id           INTEGER PRIMARY KEY,
    part_id      INTEGER NOT NULL REFERENCES parts (id),
    happened_at  INTEGER NOT NULL,
    kind         TEXT    NOT NULL,
    before_value TEXT,
    after_value  TEXT,
    actor        TEXT,
    note         TEXT
);
CREATE INDEX ix_part_events_part ON part_events (part_id, id);

CREATE TABLE drift_runs (
    id          INTEGER PRIMARY KEY,
    name        TEXT    NOT NULL,
    started_at  INTEGER NOT NULL,
    interval_us INTEGER NOT NULL CHECK (interval_us > 0),
    notes       TEXT
);

CREATE TABLE drift_channels (
    run_id  INTEGER NOT NULL REFERENCES drift_runs (id),
    channel INTEGER NOT NULL CHECK (channel >= 0),
    label   TEXT    NOT NULL,
    part_id INTEGER REFERENCES parts (id),
    PRIMARY KEY (run_id, channel)
);

CREATE TABLE drift_samples (
    run_id        INTEGER NOT NULL,
    channel       INTEGER NOT NULL,
    taken_at      INTEGER NOT NULL,
    ohms          REAL    NOT NULL,
    temperature_c REAL,
    PRIMARY KEY (run_id, taken_at, channel),
    FOREIGN KEY (run_id, channel) REFERENCES drift_channels (run_id, channel)
) WITHOUT ROWID;

CREATE TABLE drift_gaps (
    id      INTEGER PRIMARY KEY,
    run_id  INTEGER NOT NULL REFERENCES drift_runs (id),
    from_at INTEGER NOT NULL,
    to_at   INTEGER NOT NULL CHECK (to_at >= from_at),
    reason  TEXT    NOT NULL
);
CREATE INDEX ix_drift_gaps_run ON drift_gaps (run_id, from_at);
