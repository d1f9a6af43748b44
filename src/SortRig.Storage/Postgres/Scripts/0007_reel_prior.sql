-- SortRig precision log, schema version 7 (PostgreSQL): what the predictive settle rule has learned of a batch's reel
-- (the body time constants of its parts, docs/measurement.md), kept with the batch so that a resumed session goes on
-- from it instead of learning the reel again. Written in the transaction of each part that changed it; JSON text
-- (count, lowest, highest, largest error, seen, sum and sum of squares of ln tau); NULL until the first part.
ALTER TABLE batches ADD COLUMN reel_prior TEXT;
