import { MigrationInterface, QueryRunner } from "typeorm";

/**
 * Pot and plot labels sort the way people count: B1, B2 … B10, not B1, B10, B2. An ICU collation
 * with numeric ordering ("kn", CLDR/UTS #35) on the label columns makes every ORDER BY label, the
 * unique indexes and TypeORM's finds agree. Deterministic, so "B1" and "b1" stay distinct labels.
 */
export class NaturalLabelOrder1796197728392 implements MigrationInterface {
    name = 'NaturalLabelOrder1796197728392'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE COLLATION IF NOT EXISTS "natural_sort" (provider = icu, locale = 'und-u-kn-true')`);
        await queryRunner.query(`ALTER TABLE "pots" ALTER COLUMN "label" TYPE character varying(40) COLLATE "natural_sort"`);
        await queryRunner.query(`ALTER TABLE "plots" ALTER COLUMN "label" TYPE character varying(40) COLLATE "natural_sort"`);
        await queryRunner.query(`ALTER TABLE "plots" ALTER COLUMN "block_key" TYPE character varying(40) COLLATE "natural_sort"`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "plots" ALTER COLUMN "block_key" TYPE character varying(40) COLLATE "default"`);
        await queryRunner.query(`ALTER TABLE "plots" ALTER COLUMN "label" TYPE character varying(40) COLLATE "default"`);
        await queryRunner.query(`ALTER TABLE "pots" ALTER COLUMN "label" TYPE character varying(40) COLLATE "default"`);
        await queryRunner.query(`DROP COLLATION IF EXISTS "natural_sort"`);
    }
}
