-- SortRig precision log, schema version 1 (PostgreSQL).
-- Times are timestamptz (microsecond resolution). Enums are stored by name.

CREATE TABLE sessions (
    id               BIGINT GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
    name             TEXT    NOT NULL,
    operator_name    TEXT,
    notes            TEXT,
    started_at       TIMESTAMPTZ NOT NULL,
    finished_at      TIMESTAMPTZ,
    next_part_number INTEGER NOT NULL DEFAULT 1 CHECK (next_part_number >= 1)
);
CREATE INDEX ix_sessions_name ON sessions (name, finished_at);

CREATE TABLE batches (
    id                  BIGINT GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
    session_id          BIGINT NOT NULL REFERENCES sessions (id),
    started_at          TIMESTAMPTZ NOT NULL,
    nominal_ohms        DOUBLE PRECISION NOT NULL CHECK (nominal_ohms > 0),
    stock_tolerance_ppm DOUBLE PRECISION NOT NULL CHECK (stock_tolerance_ppm > 0),
    match_tolerance_ppm DOUBLE PRECISION NOT NULL CHECK (match_tolerance_ppm > 0),
    range_ohms          DOUBLE PRECISION NOT NULL CHECK (range_ohms > 0),
    nplc                DOUBLE PRECISION NOT NULL CHECK (nplc > 0),
    four_wire           BOOLEAN NOT NULL,
    meter_family        TEXT    NOT NULL,
    meter_identity      TEXT    NOT NULL,
    recipe_name         TEXT,
    rt_from_range_ohms  DOUBLE PRECISION,
    rt_to_range_ohms    DOUBLE PRECISION,
    rt_correction_ppm   DOUBLE PRECISION,
    rt_uncertainty_ppm  DOUBLE PRECISION,
    rt_measured_at      TIMESTAMPTZ
);
CREATE INDEX ix_batches_session ON batches (session_id);

CREATE TABLE parts (
    id              BIGINT GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
    commit_key      UUID    NOT NULL UNIQUE,
    session_id      BIGINT NOT NULL REFERENCES sessions (id),
    batch_id        BIGINT NOT NULL REFERENCES batches (id),
    part_number     INTEGER NOT NULL CHECK (part_number >= 1),
    nominal_ohms    DOUBLE PRECISION NOT NULL,
    value_ohms      DOUBLE PRECISION NOT NULL,
    deviation_ppm   DOUBLE PRECISION NOT NULL,
    u_standard_ohms DOUBLE PRECISION NOT NULL CHECK (u_standard_ohms >= 0),
    u_transfer_ohms DOUBLE PRECISION NOT NULL CHECK (u_transfer_ohms >= 0),
    coverage_k      DOUBLE PRECISION NOT NULL CHECK (coverage_k > 0),
    range_ohms      DOUBLE PRECISION NOT NULL,
    nplc            DOUBLE PRECISION NOT NULL,
    temperature_c   DOUBLE PRECISION,
    accepted_at     TIMESTAMPTZ NOT NULL,
    cup_label       TEXT,
    slot_label      TEXT,
    state           TEXT    NOT NULL CHECK (state IN ('Accepted', 'Announced', 'Unstable', 'Undone', 'Remeasured', 'RemovedEarly')),
    announced       BOOLEAN NOT NULL,
    location        TEXT,
    library_status  TEXT    NOT NULL CHECK (library_status IN ('Available', 'Taken', 'Used', 'Retired')),
    taken_by        TEXT,
    UNIQUE (session_id, part_number)
);
CREATE INDEX ix_parts_batch ON parts (batch_id);
CREATE INDEX ix_parts_library ON parts (library_status, nominal_ohms, deviation_ppm);

CREATE TABLE raw_readings (
    part_id    BIGINT NOT NULL REFERENCES parts (id),
    seq        INTEGER NOT NULL CHECK (seq >= 0),
    taken_at   TIMESTAMPTZ NOT NULL,
    value_ohms DOUBLE PRECISION NOT NULL,
    range_ohms DOUBLE PRECISION NOT NULL,
    kind       TEXT    NOT NULL CHECK (kind IN ('Finite', 'Overload')),
    PRIMARY KEY (part_id, seq)
);

CREATE TABLE part_events (
    id           BIGINT GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
    part_id      BIGINT NOT NULL REFERENCES parts (id),
    happened_at  TIMESTAMPTZ NOT NULL,
    kind         TEXT    NOT NULL,
    before_value TEXT,
    after_value  TEXT,
    actor        TEXT,
    note         TEXT
);
CREATE INDEX ix_part_events_part ON part_events (part_id, id);

CREATE TABLE drift_runs (
    id          BIGINT GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
    name        TEXT    NOT NULL,
    started_at  TIMESTAMPTZ NOT NULL,
    interval_us BIGINT NOT NULL CHECK (interval_us > 0),
    notes       TEXT
);

CREATE TABLE drift_channels (
    run_id  BIGINT NOT NULL REFERENCES drift_runs (id),
    channel INTEGER NOT NULL CHECK (channel >= 0),
    label   TEXT    NOT NULL,
    part_id BIGINT REFERENCES parts (id),
    PRIMARY KEY (run_id, channel)
);

CREATE TABLE drift_samples (
    run_id        BIGINT NOT NULL,
    channel       INTEGER NOT NULL,
    taken_at      TIMESTAMPTZ NOT NULL,
    ohms          DOUBLE PRECISION NOT NULL,
    temperature_c DOUBLE PRECISION,
    PRIMARY KEY (run_id, taken_at, channel),
    FOREIGN KEY (run_id, channel) REFERENCES drift_channels (run_id, channel)
);

CREATE TABLE drift_gaps (
    id      BIGINT GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
    run_id  BIGINT NOT NULL REFERENCES drift_runs (id),
    from_at TIMESTAMPTZ NOT NULL,
    to_at   TIMESTAMPTZ NOT NULL CHECK (to_at >= from_at),
    reason  TEXT    NOT NULL
);
CREATE INDEX ix_drift_gaps_run ON drift_gaps (run_id, from_at);
