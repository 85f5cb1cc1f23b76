import { MigrationInterface, QueryRunner } from "typeorm";

export class Notebook1796173447622 implements MigrationInterface {
    name = 'Notebook1796173447622'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            CREATE TABLE "gardens" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "owner_id" uuid NOT NULL,
                "name" character varying(100) NOT NULL,
                "latitude_deg" double precision NOT NULL,
                "longitude_deg" double precision NOT NULL,
                "elevation_m" double precision NOT NULL,
                "soil_texture" character varying(20) NOT NULL,
                "coastal" boolean NOT NULL DEFAULT false,
                "notes" text NOT NULL DEFAULT '',
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_05b6b052f3f345746e794d0efbe" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "gardens_owner_idx" ON "gardens" ("owner_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "trials" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "garden_id" uuid NOT NULL,
                "owner_id" uuid NOT NULL,
                "title" character varying(120) NOT NULL,
                "crop" character varying(20) NOT NULL,
                "crop_name" character varying(60) NOT NULL DEFAULT '',
                "variety" character varying(80) NOT NULL DEFAULT '',
                "planting_date" date NOT NULL,
                "end_date" date,
                "design" character varying(10) NOT NULL DEFAULT 'paired',
                "treatments" jsonb NOT NULL DEFAULT '["olla","surface"]',
                "question" text NOT NULL DEFAULT '',
                "protocol_notes" text NOT NULL DEFAULT '',
                "kc_overrides" jsonb NOT NULL DEFAULT '{}',
                "stress_thresholds" jsonb NOT NULL DEFAULT '{}',
                "status" character varying(10) NOT NULL DEFAULT 'draft',
                "randomisation_seed" character varying(64),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_afe5dc86ce7253d239c3dfea2d3" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "trials_garden_idx" ON "trials" ("garden_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "trials_owner_idx" ON "trials" ("owner_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "audit_entries" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "trial_id" uuid NOT NULL,
                "actor_id" uuid,
                "at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "action" character varying(10) NOT NULL,
                "entity_type" character varying(24) NOT NULL,
                "entity_id" uuid NOT NULL,
                "changes" jsonb NOT NULL,
                CONSTRAINT "PK_6b1623bcad4d04530b76548d619" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "audit_entries_trial_time_idx" ON "audit_entries" ("trial_id", "at")
        `);
        await queryRunner.query(`
            CREATE TABLE "plots" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "trial_id" uuid NOT NULL,
                "label" character varying(40) NOT NULL,
                "treatment" character varying(40),
                "block_key" character varying(40) NOT NULL,
                "area_m2" double precision NOT NULL,
                "setting" character varying(12) NOT NULL DEFAULT 'in_ground',
                "mulch" boolean NOT NULL DEFAULT false,
                "lid" boolean NOT NULL DEFAULT true,
                "plant_count" integer NOT NULL DEFAULT '1',
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_ba7eaba496503e69206deae9363" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "plots_trial_label_key" ON "plots" ("trial_id", "label")
        `);
        await queryRunner.query(`
            CREATE TABLE "harvests" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "trial_id" uuid NOT NULL,
                "plot_id" uuid NOT NULL,
                "entered_by" uuid,
                "idempotency_key" character varying(64),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "harvested_on" date NOT NULL,
                "fresh_kg" double precision NOT NULL,
                "count" integer,
                "marketable_kg" double precision,
                "notes" text NOT NULL DEFAULT '',
                CONSTRAINT "PK_fb748ae28bc0000875b1949a0a6" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_23864c29d7d22c19e4cd5c2137" ON "harvests" ("plot_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "harvests_idem_key" ON "harvests" ("trial_id", "idempotency_key")
            WHERE idempotency_key IS NOT NULL
        `);
        await queryRunner.query(`
            CREATE INDEX "harvests_trial_day_idx" ON "harvests" ("trial_id", "harvested_on")
        `);
        await queryRunner.query(`
            CREATE TABLE "moisture_readings" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "trial_id" uuid NOT NULL,
                "plot_id" uuid NOT NULL,
                "entered_by" uuid,
                "idempotency_key" character varying(64),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "taken_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "method" character varying(12) NOT NULL,
                "depth_cm" double precision NOT NULL,
                "value" double precision NOT NULL,
                CONSTRAINT "PK_dff7b0353cea8c994bd083c923e" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_bbe1648aaec5330101c3d1456e" ON "moisture_readings" ("plot_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "moisture_readings_idem_key" ON "moisture_readings" ("trial_id", "idempotency_key")
            WHERE idempotency_key IS NOT NULL
        `);
        await queryRunner.query(`
            CREATE INDEX "moisture_readings_trial_time_idx" ON "moisture_readings" ("trial_id", "taken_at")
        `);
        await queryRunner.query(`
            CREATE TABLE "observations" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "trial_id" uuid NOT NULL,
                "plot_id" uuid,
                "observed_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "text" text NOT NULL,
                "entered_by" uuid,
                "idempotency_key" character varying(64),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_f9208d64f50a76030758087c0ef" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "observations_idem_key" ON "observations" ("trial_id", "idempotency_key")
            WHERE idempotency_key IS NOT NULL
        `);
        await queryRunner.query(`
            CREATE INDEX "observations_trial_time_idx" ON "observations" ("trial_id", "observed_at")
        `);
        await queryRunner.query(`
            CREATE TABLE "photos" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "observation_id" uuid NOT NULL,
                "storage_key" character varying(200) NOT NULL,
                "content_type" character varying(40) NOT NULL,
                "bytes" integer NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_5220c45b8e32d49d767b9b3d725" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "photos_observation_idx" ON "photos" ("observation_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "pots" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "owner_id" uuid NOT NULL,
                "label" character varying(40) NOT NULL,
                "capacity_l" double precision NOT NULL,
                "height_cm" double precision,
                "widest_diameter_cm" double precision NOT NULL,
                "neck_diameter_cm" double precision,
                "shape" character varying(12) NOT NULL,
                "clay_body" character varying(16) NOT NULL DEFAULT 'unknown',
                "make" character varying(20) NOT NULL,
                "firing_cone" character varying(4),
                "installed_on" date,
                "plot_id" uuid,
                "condition" character varying(10) NOT NULL DEFAULT 'sound',
                "notes" text NOT NULL DEFAULT '',
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_ad91f0cc4de8269de9a1038b637" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "pots_owner_idx" ON "pots" ("owner_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "pots_plot_idx" ON "pots" ("plot_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "seep_tests" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "pot_id" uuid NOT NULL,
                "tested_on" date NOT NULL,
                "setting" character varying(16) NOT NULL,
                "litres_lost" double precision NOT NULL,
                "hours" double precision NOT NULL,
                "notes" text NOT NULL DEFAULT '',
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_c1b20ec339e5a3382cda0dd1a49" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "seep_tests_pot_idx" ON "seep_tests" ("pot_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "trial_shares" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "trial_id" uuid NOT NULL,
                "cohort_id" uuid NOT NULL,
                "shared_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "withdrawn_at" TIMESTAMP WITH TIME ZONE,
                CONSTRAINT "PK_1b9080a421135f047e202912334" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "trial_shares_cohort_idx" ON "trial_shares" ("cohort_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "trial_shares_trial_cohort_key" ON "trial_shares" ("trial_id", "cohort_id")
        `);
        await queryRunner.query(`
            CREATE TABLE "water_events" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "trial_id" uuid NOT NULL,
                "plot_id" uuid NOT NULL,
                "entered_by" uuid,
                "idempotency_key" character varying(64),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "occurred_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "kind" character varying(12) NOT NULL,
                "volume_l" double precision NOT NULL,
                "source" character varying(12) NOT NULL DEFAULT 'mains',
                "fertiliser" boolean NOT NULL DEFAULT false,
                "pot_id" uuid,
                "notes" text NOT NULL DEFAULT '',
                CONSTRAINT "PK_8ad7b13dcf03c78b1c7270e1655" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE INDEX "IDX_c3f9a6c6e5a66d5031d25d3da8" ON "water_events" ("plot_id")
        `);
        await queryRunner.query(`
            CREATE INDEX "water_events_pot_idx" ON "water_events" ("pot_id")
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "water_events_idem_key" ON "water_events" ("trial_id", "idempotency_key")
            WHERE idempotency_key IS NOT NULL
        `);
        await queryRunner.query(`
            CREATE INDEX "water_events_trial_time_idx" ON "water_events" ("trial_id", "occurred_at")
        `);
        await queryRunner.query(`
            CREATE TABLE "weather_days" (
                "id" uuid NOT NULL DEFAULT gen_random_uuid(),
                "garden_id" uuid NOT NULL,
                "day" date NOT NULL,
                "forecast" boolean NOT NULL DEFAULT false,
                "t_min_c" double precision NOT NULL,
                "t_max_c" double precision NOT NULL,
                "rain_mm" double precision NOT NULL DEFAULT '0',
                "rh_min_pct" double precision,
                "rh_max_pct" double precision,
                "wind_speed_ms" double precision,
                "wind_height_m" double precision NOT NULL DEFAULT '2',
                "sunshine_hours" double precision,
                "solar_radiation_mj" double precision,
                "entered_by" uuid,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_0cc356583a465ef1caac87356f2" PRIMARY KEY ("id")
            )
        `);
        await queryRunner.query(`
            CREATE UNIQUE INDEX "weather_days_garden_day_key" ON "weather_days" ("garden_id", "day", "forecast")
        `);
        await queryRunner.query(`
            ALTER TABLE "gardens"
            ADD CONSTRAINT "FK_fd504695d5a0165c65103baa163" FOREIGN KEY ("owner_id") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "trials"
            ADD CONSTRAINT "FK_0f374598b03bde1894d9442d7b3" FOREIGN KEY ("garden_id") REFERENCES "gardens"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "trials"
            ADD CONSTRAINT "FK_8952866bea5cf2a19fd8711be62" FOREIGN KEY ("owner_id") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "audit_entries"
            ADD CONSTRAINT "FK_132922d9553c525b35c56ab138b" FOREIGN KEY ("trial_id") REFERENCES "trials"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "audit_entries"
            ADD CONSTRAINT "FK_c2d369a2e8a9e3773f1682b8ac0" FOREIGN KEY ("actor_id") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "plots"
            ADD CONSTRAINT "FK_1ccb2ae4e40be5299ba6912b028" FOREIGN KEY ("trial_id") REFERENCES "trials"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "harvests"
            ADD CONSTRAINT "FK_0c45cc35103152e9c36c1e97c6a" FOREIGN KEY ("trial_id") REFERENCES "trials"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "harvests"
            ADD CONSTRAINT "FK_23864c29d7d22c19e4cd5c21371" FOREIGN KEY ("plot_id") REFERENCES "plots"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "harvests"
            ADD CONSTRAINT "FK_ce9e963d1d56ecdd0714eeab433" FOREIGN KEY ("entered_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "moisture_readings"
            ADD CONSTRAINT "FK_ae41adbdd2990db42b46d0c88c7" FOREIGN KEY ("trial_id") REFERENCES "trials"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "moisture_readings"
            ADD CONSTRAINT "FK_bbe1648aaec5330101c3d1456eb" FOREIGN KEY ("plot_id") REFERENCES "plots"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "moisture_readings"
            ADD CONSTRAINT "FK_e7a7cd778e596c81c452ffe8ed4" FOREIGN KEY ("entered_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "observations"
            ADD CONSTRAINT "FK_324a1afc6281bfe5bac8569f9d9" FOREIGN KEY ("trial_id") REFERENCES "trials"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "observations"
            ADD CONSTRAINT "FK_8382c16418180b69d813bbb3647" FOREIGN KEY ("plot_id") REFERENCES "plots"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "observations"
            ADD CONSTRAINT "FK_4a79ee5fac60ce9a4681601ddb5" FOREIGN KEY ("entered_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "photos"
            ADD CONSTRAINT "FK_e004a62f55acd6027dbd12530b8" FOREIGN KEY ("observation_id") REFERENCES "observations"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "pots"
            ADD CONSTRAINT "FK_3fb8d5d5e63ff66f681d0ac95fa" FOREIGN KEY ("owner_id") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "pots"
            ADD CONSTRAINT "FK_e9b1f8d6f78fca8f2d352eb48ca" FOREIGN KEY ("plot_id") REFERENCES "plots"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "seep_tests"
            ADD CONSTRAINT "FK_543aff0f2ee93a6b8f7d714384f" FOREIGN KEY ("pot_id") REFERENCES "pots"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "trial_shares"
            ADD CONSTRAINT "FK_210d0aaf4f416c3226d6397c5be" FOREIGN KEY ("trial_id") REFERENCES "trials"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "trial_shares"
            ADD CONSTRAINT "FK_99b8f8b744b42790c9c77f0fa3a" FOREIGN KEY ("cohort_id") REFERENCES "cohorts"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "water_events"
            ADD CONSTRAINT "FK_c3a5cb08c9b09e72bead98a860d" FOREIGN KEY ("trial_id") REFERENCES "trials"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "water_events"
            ADD CONSTRAINT "FK_c3f9a6c6e5a66d5031d25d3da80" FOREIGN KEY ("plot_id") REFERENCES "plots"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "water_events"
            ADD CONSTRAINT "FK_b29ec5a74a3cb706af407b56ec5" FOREIGN KEY ("entered_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "water_events"
            ADD CONSTRAINT "FK_5fe3f7b930feb2bf106b4912f31" FOREIGN KEY ("pot_id") REFERENCES "pots"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_days"
            ADD CONSTRAINT "FK_d3c4eeff2a265bd7449dd64294d" FOREIGN KEY ("garden_id") REFERENCES "gardens"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_days"
            ADD CONSTRAINT "FK_f3f8b7ceeb0119218429ff09659" FOREIGN KEY ("entered_by") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`
            ALTER TABLE "weather_days" DROP CONSTRAINT "FK_f3f8b7ceeb0119218429ff09659"
        `);
        await queryRunner.query(`
            ALTER TABLE "weather_days" DROP CONSTRAINT "FK_d3c4eeff2a265bd7449dd64294d"
        `);
        await queryRunner.query(`
            ALTER TABLE "water_events" DROP CONSTRAINT "FK_5fe3f7b930feb2bf106b4912f31"
        `);
        await queryRunner.query(`
            ALTER TABLE "water_events" DROP CONSTRAINT "FK_b29ec5a74a3cb706af407b56ec5"
        `);
        await queryRunner.query(`
            ALTER TABLE "water_events" DROP CONSTRAINT "FK_c3f9a6c6e5a66d5031d25d3da80"
        `);
        await queryRunner.query(`
            ALTER TABLE "water_events" DROP CONSTRAINT "FK_c3a5cb08c9b09e72bead98a860d"
        `);
        await queryRunner.query(`
            ALTER TABLE "trial_shares" DROP CONSTRAINT "FK_99b8f8b744b42790c9c77f0fa3a"
        `);
        await queryRunner.query(`
            ALTER TABLE "trial_shares" DROP CONSTRAINT "FK_210d0aaf4f416c3226d6397c5be"
        `);
        await queryRunner.query(`
            ALTER TABLE "seep_tests" DROP CONSTRAINT "FK_543aff0f2ee93a6b8f7d714384f"
        `);
        await queryRunner.query(`
            ALTER TABLE "pots" DROP CONSTRAINT "FK_e9b1f8d6f78fca8f2d352eb48ca"
        `);
        await queryRunner.query(`
            ALTER TABLE "pots" DROP CONSTRAINT "FK_3fb8d5d5e63ff66f681d0ac95fa"
        `);
        await queryRunner.query(`
            ALTER TABLE "photos" DROP CONSTRAINT "FK_e004a62f55acd6027dbd12530b8"
        `);
        await queryRunner.query(`
            ALTER TABLE "observations" DROP CONSTRAINT "FK_4a79ee5fac60ce9a4681601ddb5"
        `);
        await queryRunner.query(`
            ALTER TABLE "observations" DROP CONSTRAINT "FK_8382c16418180b69d813bbb3647"
        `);
        await queryRunner.query(`
            ALTER TABLE "observations" DROP CONSTRAINT "FK_324a1afc6281bfe5bac8569f9d9"
        `);
        await queryRunner.query(`
            ALTER TABLE "moisture_readings" DROP CONSTRAINT "FK_e7a7cd778e596c81c452ffe8ed4"
        `);
        await queryRunner.query(`
            ALTER TABLE "moisture_readings" DROP CONSTRAINT "FK_bbe1648aaec5330101c3d1456eb"
        `);
        await queryRunner.query(`
            ALTER TABLE "moisture_readings" DROP CONSTRAINT "FK_ae41adbdd2990db42b46d0c88c7"
        `);
        await queryRunner.query(`
            ALTER TABLE "harvests" DROP CONSTRAINT "FK_ce9e963d1d56ecdd0714eeab433"
        `);
        await queryRunner.query(`
            ALTER TABLE "harvests" DROP CONSTRAINT "FK_23864c29d7d22c19e4cd5c21371"
        `);
        await queryRunner.query(`
            ALTER TABLE "harvests" DROP CONSTRAINT "FK_0c45cc35103152e9c36c1e97c6a"
        `);
        await queryRunner.query(`
            ALTER TABLE "plots" DROP CONSTRAINT "FK_1ccb2ae4e40be5299ba6912b028"
        `);
        await queryRunner.query(`
            ALTER TABLE "audit_entries" DROP CONSTRAINT "FK_c2d369a2e8a9e3773f1682b8ac0"
        `);
        await queryRunner.query(`
            ALTER TABLE "audit_entries" DROP CONSTRAINT "FK_132922d9553c525b35c56ab138b"
        `);
        await queryRunner.query(`
            ALTER TABLE "trials" DROP CONSTRAINT "FK_8952866bea5cf2a19fd8711be62"
        `);
        await queryRunner.query(`
            ALTER TABLE "trials" DROP CONSTRAINT "FK_0f374598b03bde1894d9442d7b3"
        `);
        await queryRunner.query(`
            ALTER TABLE "gardens" DROP CONSTRAINT "FK_fd504695d5a0165c65103baa163"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."weather_days_garden_day_key"
        `);
        await queryRunner.query(`
            DROP TABLE "weather_days"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."water_events_trial_time_idx"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."water_events_idem_key"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."water_events_pot_idx"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_c3f9a6c6e5a66d5031d25d3da8"
        `);
        await queryRunner.query(`
            DROP TABLE "water_events"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."trial_shares_trial_cohort_key"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."trial_shares_cohort_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "trial_shares"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."seep_tests_pot_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "seep_tests"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."pots_plot_idx"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."pots_owner_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "pots"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."photos_observation_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "photos"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."observations_trial_time_idx"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."observations_idem_key"
        `);
        await queryRunner.query(`
            DROP TABLE "observations"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."moisture_readings_trial_time_idx"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."moisture_readings_idem_key"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_bbe1648aaec5330101c3d1456e"
        `);
        await queryRunner.query(`
            DROP TABLE "moisture_readings"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."harvests_trial_day_idx"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."harvests_idem_key"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."IDX_23864c29d7d22c19e4cd5c2137"
        `);
        await queryRunner.query(`
            DROP TABLE "harvests"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."plots_trial_label_key"
        `);
        await queryRunner.query(`
            DROP TABLE "plots"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."audit_entries_trial_time_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "audit_entries"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."trials_owner_idx"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."trials_garden_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "trials"
        `);
        await queryRunner.query(`
            DROP INDEX "public"."gardens_owner_idx"
        `);
        await queryRunner.query(`
            DROP TABLE "gardens"
        `);
    }

}
