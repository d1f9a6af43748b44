-- SortRig precision log, schema version 2 (PostgreSQL): drift runs by library part.
-- Finding the drift runs of library parts: channels by part, and each channel's samples as one index range
-- (the primary key of drift_samples is ordered by time first, so without this a channel's first/last/count
-- would scan every sample of its run).
CREATE INDEX ix_drift_channels_part ON drift_channels (part_id, run_id);
CREATE INDEX ix_drift_samples_channel ON drift_samples (run_id, channel, taken_at);
