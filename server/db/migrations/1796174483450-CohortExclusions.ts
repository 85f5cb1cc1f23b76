import { MigrationInterface, QueryRunner } from "typeorm";

export class CohortExclusions1796174483450 implements MigrationInterface {
    name = 'CohortExclusions1796174483450'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "trial_exclusions" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "cohort_id" uuid NOT NULL,
                "trial_id" uuid NOT NULL,
                "reason" text NOT NULL,
                "excluded_by" uuid,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_0e129973b520c5b30ae8f99792b" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "trial_exclusions_trial_idx" ON "trial_exclusions" ("trial_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "trial_exclusions_cohort_trial_key" ON "trial_exclusions" ("cohort_id", "trial_id")
        `);
        await queryRunner.query(`
            ALTER TABLE "trial_exclusions"
            ADD CONSTRAINT "FK_737623b441658fd42192e1689fd" FOREIGN KEY ("cohort_id") REFERENCES "cohorts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "trial_exclusions"
            ADD CONSTRAINT "FK_bea779a8a749a87c22ea79d8d1e" FOREIGN KEY ("trial_id") REFERENCES "trials"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "trial_exclusions"
            ADD CONSTRAINT "FK_2cb6c50536a11dac8f6be4f0e67" FOREIGN KEY ("excluded_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "trial_exclusions" DROP CONSTRAINT "FK_2cb6c50536a11dac8f6be4f0e67"
        `);
        await queryRunner.query(`
            ALTER TABLE "trial_exclusions" DROP CONSTRAINT "FK_bea779a8a749a87c22ea79d8d1e"
        `);
        await queryRunner.query(`
            ALTER TABLE "trial_exclusions" DROP CONSTRAINT "FK_737623b441658fd42192e1689fd"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."trial_exclusions_cohort_trial_key"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."trial_exclusions_trial_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "trial_exclusions"
        `);
    }

}
