import type { MigrationInterface, QueryRunner } from 'typeorm';

export class HealthFigures1796166427505 implements MigrationInterface {
  name = 'HealthFigures1796166427505';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`generating_unit\` ADD \`analysis\` json NULL`);
    await q.query(`ALTER TABLE \`daily_aggregate\` ADD \`trendCleanliness\` double NULL`);
    await q.query(`ALTER TABLE \`daily_aggregate\` ADD \`meanSubcoolingK\` double NULL`);
    await q.query(`ALTER TABLE \`daily_aggregate\` ADD \`meanDissolvedOxygenPpb\` double NULL`);
    await q.query(`ALTER TABLE \`daily_aggregate\` ADD \`meanAirRemovalKgS\` double NULL`);
    await q.query(`ALTER TABLE \`daily_aggregate\` ADD \`airLeakSuspected\` tinyint NOT NULL DEFAULT 0`);
    await q.query(`ALTER TABLE \`daily_aggregate\` ADD \`meanDutyMw\` double NULL`);
    await q.query(`ALTER TABLE \`daily_aggregate\` ADD \`heatBalanceDutyMw\` double NULL`);
    await q.query(`ALTER TABLE \`daily_aggregate\` ADD \`stuckSensors\` json NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`daily_aggregate\` DROP COLUMN \`stuckSensors\``);
    await q.query(`ALTER TABLE \`daily_aggregate\` DROP COLUMN \`heatBalanceDutyMw\``);
    await q.query(`ALTER TABLE \`daily_aggregate\` DROP COLUMN \`meanDutyMw\``);
    await q.query(`ALTER TABLE \`daily_aggregate\` DROP COLUMN \`airLeakSuspected\``);
    await q.query(`ALTER TABLE \`daily_aggregate\` DROP COLUMN \`meanAirRemovalKgS\``);
    await q.query(`ALTER TABLE \`daily_aggregate\` DROP COLUMN \`meanDissolvedOxygenPpb\``);
    await q.query(`ALTER TABLE \`daily_aggregate\` DROP COLUMN \`meanSubcoolingK\``);
    await q.query(`ALTER TABLE \`daily_aggregate\` DROP COLUMN \`trendCleanliness\``);
    await q.query(`ALTER TABLE \`generating_unit\` DROP COLUMN \`analysis\``);
  }
}
