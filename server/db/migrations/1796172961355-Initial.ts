import { MigrationInterface, QueryRunner } from "typeorm";

export class Initial1796172961355 implements MigrationInterface {
    name = 'Initial1796172961355'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "users" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "email" character varying(254) NOT NULL,
                "password_hash" character varying(100) NOT NULL,
                "display_name" character varying(80) NOT NULL,
                "role" character varying(16) NOT NULL DEFAULT 'grower',
                "unit_system" character varying(8) NOT NULL DEFAULT 'metric',
                "language" character varying(8) NOT NULL DEFAULT 'en',
                "email_verified_at" TIMESTAMP WITH TIME ZONE,
                "disabled_at" TIMESTAMP WITH TIME ZONE,
                "sessions_valid_after" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_a3ffb1c0c8416b9fc6f907b7433" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "users_email_key" ON "users" ("email")
        `);
        await queryRunner.query(`
            CREATE TABLE "cohorts" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "name" character varying(120) NOT NULL,
                "description" text NOT NULL DEFAULT '',
                "kind" character varying(16) NOT NULL DEFAULT 'programme',
                "lead_id" uuid NOT NULL,
                "join_code" character varying(16) NOT NULL,
                "capacity" integer,
                "closed_at" TIMESTAMP WITH TIME ZONE,
                "licence" character varying(32) NOT NULL DEFAULT 'CC-BY-4.0',
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_fd38f76b135e907b834fda1e752" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "cohorts_lead_idx" ON "cohorts" ("lead_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "cohorts_join_code_key" ON "cohorts" ("join_code")
        `);
        await queryRunner.query(`
            CREATE TABLE "cohort_invitations" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "cohort_id" uuid NOT NULL,
                "email" character varying(254) NOT NULL,
                "role" character varying(16) NOT NULL,
                "token_hash" character varying(64) NOT NULL,
                "expires_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "accepted_at" TIMESTAMP WITH TIME ZONE,
                "invited_by_id" uuid NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_a0e2ca8f0f938477aec78871248" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "cohort_invitations_cohort_idx" ON "cohort_invitations" ("cohort_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "cohort_invitations_token_key" ON "cohort_invitations" ("token_hash")
        `);
        await queryRunner.query(`
            CREATE TABLE "cohort_memberships" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "cohort_id" uuid NOT NULL,
                "user_id" uuid NOT NULL,
                "role" character varying(16) NOT NULL,
                "pseudonym" character varying(32) NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_a9135bbd76e714bac711ae85347" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "cohort_memberships_user_idx" ON "cohort_memberships" ("user_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "cohort_memberships_cohort_pseudonym_key" ON "cohort_memberships" ("cohort_id", "pseudonym")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "cohort_memberships_cohort_user_key" ON "cohort_memberships" ("cohort_id", "user_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "session" (
                "sid" character varying NOT NULL,
                "sess" json NOT NULL,
                "expire" TIMESTAMP(6) NOT NULL,
                CONSTRAINT "PK_7575923e18b495ed2307ae629ae" PRIMARY KEY ("sid")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_session_expire" ON "session" ("expire")
        `);
        await queryRunner.query(`
            CREATE TABLE "user_tokens" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "user_id" uuid NOT NULL,
                "purpose" character varying(24) NOT NULL,
                "token_hash" character varying(64) NOT NULL,
                "expires_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "used_at" TIMESTAMP WITH TIME ZONE,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_63764db9d9aaa4af33e07b2f4bf" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "user_tokens_user_idx" ON "user_tokens" ("user_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "user_tokens_hash_key" ON "user_tokens" ("token_hash")
        `);
        await queryRunner.query(`
            ALTER TABLE "cohorts"
            ADD CONSTRAINT "FK_7508f0df773db3584f436ce5f7a" FOREIGN KEY ("lead_id") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "cohort_invitations"
            ADD CONSTRAINT "FK_be7add9f07c15e5a32504c69996" FOREIGN KEY ("cohort_id") REFERENCES "cohorts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "cohort_invitations"
            ADD CONSTRAINT "FK_2f30cd6f2fcf4d34da2dfe5eb72" FOREIGN KEY ("invited_by_id") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "cohort_memberships"
            ADD CONSTRAINT "FK_6af7e5a4f90a5b0f64ee4ef6a37" FOREIGN KEY ("cohort_id") REFERENCES "cohorts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "cohort_memberships"
            ADD CONSTRAINT "FK_a3e85287f1f423c11e67f67ace5" FOREIGN KEY ("user_id") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "user_tokens"
            ADD CONSTRAINT "FK_9e144a67be49e5bba91195ef5de" FOREIGN KEY ("user_id") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "user_tokens" DROP CONSTRAINT "FK_9e144a67be49e5bba91195ef5de"
        `);
        await queryRunner.query(`
            ALTER TABLE "cohort_memberships" DROP CONSTRAINT "FK_a3e85287f1f423c11e67f67ace5"
        `);
        await queryRunner.query(`
            ALTER TABLE "cohort_memberships" DROP CONSTRAINT "FK_6af7e5a4f90a5b0f64ee4ef6a37"
        `);
        await queryRunner.query(`
            ALTER TABLE "cohort_invitations" DROP CONSTRAINT "FK_2f30cd6f2fcf4d34da2dfe5eb72"
        `);
        await queryRunner.query(`
            ALTER TABLE "cohort_invitations" DROP CONSTRAINT "FK_be7add9f07c15e5a32504c69996"
        `);
        await queryRunner.query(`
            ALTER TABLE "cohorts" DROP CONSTRAINT "FK_7508f0df773db3584f436ce5f7a"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."user_tokens_hash_key"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."user_tokens_user_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "user_tokens"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_session_expire"
        `);
        await queryRunner.query(`
            DROP TABLE "session"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."cohort_memberships_cohort_user_key"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."cohort_memberships_cohort_pseudonym_key"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."cohort_memberships_user_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "cohort_memberships"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."cohort_invitations_token_key"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."cohort_invitations_cohort_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "cohort_invitations"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."cohorts_join_code_key"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."cohorts_lead_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "cohorts"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."users_email_key"
        `);
        await queryRunner.query(`
            DROP TABLE "users"
        `);
    }

}
