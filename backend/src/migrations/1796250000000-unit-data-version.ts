import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A unit's data version: rises whenever the recompute replaces its daily figures or stores its analysis, so a
 * view cached by any process can tell from one cheap read that what it holds is stale.
 */
export class UnitDataVersion1796250000000 implements MigrationInterface {
  name = 'UnitDataVersion1796250000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`generating_unit\` ADD \`dataVersion\` int NOT NULL DEFAULT '1'`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`generating_unit\` DROP COLUMN \`dataVersion\``);
  }
}
