import { MigrationInterface, QueryRunner } from "typeorm";

export class Notifications1796175730534 implements MigrationInterface {
    name = 'Notifications1796175730534'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "notification_preferences" (
                "user_id" uuid NOT NULL,
                "refill_reminders" boolean NOT NULL DEFAULT true,
                "refill_threshold_pct" integer NOT NULL DEFAULT '25',
                "frost_warnings" boolean NOT NULL DEFAULT true,
                "weekly_digest" boolean NOT NULL DEFAULT true,
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_64c90edc7310c6be7c10c96f675" PRIMARY KEY ("user_id")
            )
        `);
        await queryRunner.query(`
            CREATE TABLE "notification_sends" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "user_id" uuid NOT NULL,
                "kind" character varying(12) NOT NULL,
                "subject_key" character varying(80) NOT NULL,
                "day" date NOT NULL,
                "status" character varying(10) NOT NULL DEFAULT 'pending',
                "claimed_at" TIMESTAMP WITH TIME ZONE,
                "attempts" integer NOT NULL DEFAULT '1',
                "sent_at" TIMESTAMP WITH TIME ZONE,
                "payload" jsonb NOT NULL DEFAULT '{}',
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_97112f3ed8784fdb76b202aafdb" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "notification_sends_key" ON "notification_sends" ("user_id", "kind", "subject_key", "day")
        `);
        await queryRunner.query(`
            ALTER TABLE "notification_preferences"
            ADD CONSTRAINT "FK_64c90edc7310c6be7c10c96f675" FOREIGN KEY ("user_id") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "notification_sends"
            ADD CONSTRAINT "FK_3557ea445495fa01f478cc6c920" FOREIGN KEY ("user_id") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "notification_sends" DROP CONSTRAINT "FK_3557ea445495fa01f478cc6c920"
        `);
        await queryRunner.query(`
            ALTER TABLE "notification_preferences" DROP CONSTRAINT "FK_64c90edc7310c6be7c10c96f675"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."notification_sends_key"
        `);
        await queryRunner.query(`
            DROP TABLE "notification_sends"
        `);
        await queryRunner.query(`
            DROP TABLE "notification_preferences"
        `);
    }

}
