import { MigrationInterface, QueryRunner } from "typeorm";

export class GardenTimeZone1796211355813 implements MigrationInterface {
    name = 'GardenTimeZone1796211355813'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "gardens"
            ADD "time_zone" character varying(64) NOT NULL DEFAULT 'UTC'
        `);

        // Hand-written (not generated): the cohort log rollups bucket water events into weeks of the
        // garden's days (server/services/log-rollups.ts), so a garden changing its time zone, or a
        // trial moving to another garden, makes the trials' rollups stale like a log write does.
        await queryRunner.query(`
            CREATE FUNCTION garden_time_zone_bump_trials() RETURNS trigger LANGUAGE plpgsql AS $$
            BEGIN
                UPDATE trials SET data_version = data_version + 1
                 WHERE garden_id IN (SELECT n.id FROM old_rows o JOIN new_rows n ON n.id = o.id WHERE o.time_zone IS DISTINCT FROM n.time_zone);
                RETURN NULL;
            END $$
        `);
        await queryRunner.query(`
            CREATE TRIGGER gardens_time_zone_upd AFTER UPDATE ON gardens
            REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION garden_time_zone_bump_trials()
        `);
        await queryRunner.query(`
            CREATE FUNCTION trial_garden_bump_version() RETURNS trigger LANGUAGE plpgsql AS $$
            BEGIN
                NEW.data_version := OLD.data_version + 1;
                RETURN NEW;
            END $$
        `);
        await queryRunner.query(`
            CREATE TRIGGER trials_garden_upd BEFORE UPDATE OF garden_id ON trials
            FOR EACH ROW WHEN (OLD.garden_id IS DISTINCT FROM NEW.garden_id) EXECUTE FUNCTION trial_garden_bump_version()
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP TRIGGER trials_garden_upd ON trials`);
        await queryRunner.query(`DROP FUNCTION trial_garden_bump_version()`);
        await queryRunner.query(`DROP TRIGGER gardens_time_zone_upd ON gardens`);
        await queryRunner.query(`DROP FUNCTION garden_time_zone_bump_trials()`);
        await queryRunner.query(`
            ALTER TABLE "gardens" DROP COLUMN "time_zone"
        `);
    }

}
