-- The DEFAULT partitions of reading and evaluation go. They were meant to stay empty, but with several service
-- instances one could drop a day's partition (retention) while another, trusting its list of partitions, still
-- wrote that day: the rows landed in the default partition, where retention never looks, and from then on
-- creating that day's partition failed on every instance. Without a default partition such a write fails; the
-- service then creates the day (under its advisory lock) and writes again. Rows already in a default partition
-- move into daily partitions (UTC days, named <table>_pYYYYMMDD as the service names them).
DO $$
DECLARE
    t text;
    d date;
    part text;
BEGIN
    FOREACH t IN ARRAY ARRAY['reading', 'evaluation'] LOOP
        IF to_regclass(t || '_default') IS NULL THEN
            CONTINUE;
        END IF;
        EXECUTE format('CREATE TEMP TABLE %I ON COMMIT DROP AS SELECT * FROM %I', 'moved_' || t, t || '_default');
        EXECUTE format('DROP TABLE %I', t || '_default');
        FOR d IN EXECUTE format('SELECT DISTINCT (time AT TIME ZONE ''UTC'')::date FROM %I', 'moved_' || t) LOOP
            part := t || '_p' || to_char(d, 'YYYYMMDD');
            IF to_regclass(part) IS NULL THEN
                EXECUTE format('CREATE TABLE %I PARTITION OF %I FOR VALUES FROM (%L) TO (%L)',
                               part, t, d::text || ' 00:00:00+00', (d + 1)::text || ' 00:00:00+00');
            END IF;
        END LOOP;
        EXECUTE format('INSERT INTO %I SELECT * FROM %I', t, 'moved_' || t);
    END LOOP;
END
$$;
