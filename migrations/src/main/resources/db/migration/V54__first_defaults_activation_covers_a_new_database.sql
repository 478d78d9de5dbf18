-- V35 recorded defaults version 1 as in force from the moment it ran, in every database. In a database that
-- held no readings then (a fresh install), that row made version 1 judge every time before the first start of
-- the service, so a historian's backfill right after installing was judged by the oldest defaults while the
-- board (today's limits) showed another level. A database without readings or lab results has nothing that
-- any version judged yet: its activations are cleared here, and the service's first start records the
-- version it brings, which as the first activation also covers every earlier time.
-- Databases that already hold data keep their record unchanged.
DO $$
BEGIN
    IF NOT EXISTS (SELECT 1 FROM reading LIMIT 1) AND NOT EXISTS (SELECT 1 FROM lab_result LIMIT 1) THEN
        ALTER TABLE limit_defaults_activation DISABLE TRIGGER limit_defaults_activation_append_only;
        DELETE FROM limit_defaults_activation;
        ALTER TABLE limit_defaults_activation ENABLE TRIGGER limit_defaults_activation_append_only;
    END IF;
END
$$;
