import { MigrationInterface, QueryRunner } from "typeorm";

export class CohortLogRollups1796186007321 implements MigrationInterface {
    name = 'CohortLogRollups1796186007321'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "trial_log_summaries" (
                "trial_id" uuid NOT NULL,
                "data_version" bigint NOT NULL,
                "harvest_records" integer NOT NULL,
                "moisture_methods" text array NOT NULL,
                "computed_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_600e8331a6b0f50fc34743f4524" PRIMARY KEY ("trial_id")
            )
        `);
        await queryRunner.query(`
            CREATE TABLE "plot_log_totals" (
                "plot_id" uuid NOT NULL,
                "trial_id" uuid NOT NULL,
                "water_l" double precision NOT NULL,
                "harvest_kg" double precision NOT NULL,
                "harvest_records" integer NOT NULL,
                CONSTRAINT "PK_e192532c261a9996465a920e562" PRIMARY KEY ("plot_id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "plot_log_totals_trial_idx" ON "plot_log_totals" ("trial_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "trial_week_water" (
                "trial_id" uuid NOT NULL,
                "kind" character varying(12) NOT NULL,
                "treatment" character varying(40) NOT NULL,
                "week_start" date NOT NULL,
                "litres" double precision NOT NULL,
                "events" integer NOT NULL,
                "day_mask" integer NOT NULL,
                CONSTRAINT "PK_2c630372f406cca69832079d468" PRIMARY KEY ("trial_id", "kind", "treatment", "week_start")
            )
        `);
        await queryRunner.query(`
            ALTER TABLE "trials"
            ADD "data_version" bigint NOT NULL DEFAULT '0'
        `);
        await queryRunner.query(`
            ALTER TABLE "trial_log_summaries"
            ADD CONSTRAINT "FK_600e8331a6b0f50fc34743f4524" FOREIGN KEY ("trial_id") REFERENCES "trials"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "plot_log_totals"
            ADD CONSTRAINT "FK_e192532c261a9996465a920e562" FOREIGN KEY ("plot_id") REFERENCES "plots"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "plot_log_totals"
            ADD CONSTRAINT "FK_e586cd815dbe61ead167a2d8979" FOREIGN KEY ("trial_id") REFERENCES "trials"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "trial_week_water"
            ADD CONSTRAINT "FK_96552c856061bc664f11337095e" FOREIGN KEY ("trial_id") REFERENCES "trials"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);

        // Hand-written (not generated): the triggers that keep trials.data_version moving with every
        // write to a trial's logs or plot treatments, in the writer's own transaction, whichever code
        // path writes (services, imports, cascades, psql). Statement-level with transition tables, so
        // an import of 100,000 rows bumps its trial once per statement, not once per row.
        await queryRunner.query(`
            CREATE FUNCTION trial_data_version_bump_new() RETURNS trigger LANGUAGE plpgsql AS $$
            BEGIN
                UPDATE trials SET data_version = data_version + 1 WHERE id IN (SELECT DISTINCT trial_id FROM new_rows);
                RETURN NULL;
            END $$
        `);
        await queryRunner.query(`
            CREATE FUNCTION trial_data_version_bump_old() RETURNS trigger LANGUAGE plpgsql AS $$
            BEGIN
                UPDATE trials SET data_version = data_version + 1 WHERE id IN (SELECT DISTINCT trial_id FROM old_rows);
                RETURN NULL;
            END $$
        `);
        await queryRunner.query(`
            CREATE FUNCTION trial_data_version_bump_both() RETURNS trigger LANGUAGE plpgsql AS $$
            BEGIN
                UPDATE trials SET data_version = data_version + 1
                 WHERE id IN (SELECT trial_id FROM old_rows UNION SELECT trial_id FROM new_rows);
                RETURN NULL;
            END $$
        `);
        // Plot edits matter to the rollups only through the treatment (or a move to another trial).
        await queryRunner.query(`
            CREATE FUNCTION trial_data_version_bump_plots() RETURNS trigger LANGUAGE plpgsql AS $$
            BEGIN
                UPDATE trials SET data_version = data_version + 1
                 WHERE id IN (SELECT o.trial_id FROM old_rows o JOIN new_rows n ON n.id = o.id
                               WHERE o.treatment IS DISTINCT FROM n.treatment OR o.trial_id <> n.trial_id
                              UNION
                              SELECT n.trial_id FROM old_rows o JOIN new_rows n ON n.id = o.id
                               WHERE o.treatment IS DISTINCT FROM n.treatment OR o.trial_id <> n.trial_id);
                RETURN NULL;
            END $$
        `);
        for (const table of ['water_events', 'moisture_readings', 'harvests']) {
            await queryRunner.query(`
                CREATE TRIGGER ${table}_data_version_ins AFTER INSERT ON ${table}
                REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION trial_data_version_bump_new()
            `);
            await queryRunner.query(`
                CREATE TRIGGER ${table}_data_version_upd AFTER UPDATE ON ${table}
                REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION trial_data_version_bump_both()
            `);
            await queryRunner.query(`
                CREATE TRIGGER ${table}_data_version_del AFTER DELETE ON ${table}
                REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION trial_data_version_bump_old()
            `);
        }
        await queryRunner.query(`
            CREATE TRIGGER plots_data_version_upd AFTER UPDATE ON plots
            REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION trial_data_version_bump_plots()
        `);
        await queryRunner.query(`
            CREATE TRIGGER plots_data_version_del AFTER DELETE ON plots
            REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION trial_data_version_bump_old()
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP TRIGGER plots_data_version_del ON plots`);
        await queryRunner.query(`DROP TRIGGER plots_data_version_upd ON plots`);
        for (const table of ['water_events', 'moisture_readings', 'harvests']) {
            for (const op of ['ins', 'upd', 'del']) await queryRunner.query(`DROP TRIGGER ${table}_data_version_${op} ON ${table}`);
        }
        for (const fn of ['new', 'old', 'both', 'plots']) await queryRunner.query(`DROP FUNCTION trial_data_version_bump_${fn}()`);
        await queryRunner.query(`
            ALTER TABLE "trial_week_water" DROP CONSTRAINT "FK_96552c856061bc664f11337095e"
        `);
        await queryRunner.query(`
            ALTER TABLE "plot_log_totals" DROP CONSTRAINT "FK_e586cd815dbe61ead167a2d8979"
        `);
        await queryRunner.query(`
            ALTER TABLE "plot_log_totals" DROP CONSTRAINT "FK_e192532c261a9996465a920e562"
        `);
        await queryRunner.query(`
            ALTER TABLE "trial_log_summaries" DROP CONSTRAINT "FK_600e8331a6b0f50fc34743f4524"
        `);
        await queryRunner.query(`
            ALTER TABLE "trials" DROP COLUMN "data_version"
        `);
        await queryRunner.query(`
            DROP TABLE "trial_week_water"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."plot_log_totals_trial_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "plot_log_totals"
        `);
        await queryRunner.query(`
            DROP TABLE "trial_log_summaries"
        `);
    }

}
