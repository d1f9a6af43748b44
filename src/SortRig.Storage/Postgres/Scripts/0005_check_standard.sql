-- SortRig precision log, schema version 5 (PostgreSQL): the check standard. Each reading of the session's check part
-- with the control chart's verdict (one row per check, idempotent by commit_key), and the parts a check out of
-- control put under suspicion (measured since the last good check; suspect until measured again).
CREATE TABLE check_readings (
    id                BIGSERIAL        PRIMARY KEY,
    commit_key        UUID             NOT NULL UNIQUE,
    session_id        BIGINT           NOT NULL REFERENCES sessions (id),
    seq               INTEGER          NOT NULL CHECK (seq >= 1),
    check_name        TEXT             NOT NULL,
    taken_at          TIMESTAMPTZ      NOT NULL,
    value_ohms        DOUBLE PRECISION NOT NULL,
    range_ohms        DOUBLE PRECISION NOT NULL,
    u_standard_ohms   DOUBLE PRECISION NOT NULL CHECK (u_standard_ohms >= 0),
    calibrated_ohms   DOUBLE PRECISION,
    centre_ohms       DOUBLE PRECISION,
    sigma_ohms        DOUBLE PRECISION,
    scale_factor      DOUBLE PRECISION NOT NULL CHECK (scale_factor > 0),
    in_control        BOOLEAN          NOT NULL,
    rule              TEXT             NOT NULL,
    reason            TEXT,
    after_part_number INTEGER          NOT NULL CHECK (after_part_number >= 0),
    flagged_count     INTEGER          NOT NULL CHECK (flagged_count >= 0),
    UNIQUE (session_id, seq)
);
CREATE INDEX ix_check_readings_name ON check_readings (check_name, taken_at);

CREATE TABLE suspect_parts (
    part_id  BIGINT PRIMARY KEY REFERENCES parts (id),
    check_id BIGINT NOT NULL REFERENCES check_readings (id)
);
CREATE INDEX ix_suspect_parts_check ON suspect_parts (check_id);
