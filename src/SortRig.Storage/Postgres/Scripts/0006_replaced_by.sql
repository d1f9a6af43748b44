-- SortRig precision log, schema version 6 (PostgreSQL): a part measured again points at the record that replaced
-- it, so a resumed session links the two by a column instead of reading the history note. Parts measured again
-- before this version get the link from that note ("measured again after a check as part N", N in the same session).
ALTER TABLE parts ADD COLUMN replaced_by BIGINT REFERENCES parts (id);

UPDATE parts
SET replaced_by = (
    SELECT n.id
    FROM part_events e
    JOIN parts n
      ON n.session_id = parts.session_id
     AND n.part_number = CAST(substring(e.note FROM length('measured again after a check as part ') + 1) AS INTEGER)
    WHERE e.part_id = parts.id
      AND e.kind = 'Remeasured'
      AND e.note ~ '^measured again after a check as part [0-9]+$'
    ORDER BY e.id DESC
    LIMIT 1
)
WHERE state = 'Remeasured';
