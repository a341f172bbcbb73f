import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Historian exports as plants write them: an organisation's own historian status words, and samples the historian
 * marked (status word or quality flag) stored with their required readings empty (validity `instrument-status`).
 * Going down, such rows cannot be kept (the old columns require a reading) and are deleted.
 */
export class HistorianShapes1796260000000 implements MigrationInterface {
  name = 'HistorianShapes1796260000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`organisation\` ADD \`historianStatusWords\` json NULL`);
    for (const c of ['loadMw', 'backpressureKpa', 'cwInletC', 'cwOutletC', 'cwFlowM3s']) {
      await q.query(`ALTER TABLE \`performance_sample\` MODIFY \`${c}\` double NULL`);
    }
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(
      `DELETE FROM \`performance_sample\` WHERE \`loadMw\` IS NULL OR \`backpressureKpa\` IS NULL OR \`cwInletC\` IS NULL OR \`cwOutletC\` IS NULL OR \`cwFlowM3s\` IS NULL`,
    );
    for (const c of ['loadMw', 'backpressureKpa', 'cwInletC', 'cwOutletC', 'cwFlowM3s']) {
      await q.query(`ALTER TABLE \`performance_sample\` MODIFY \`${c}\` double NOT NULL`);
    }
    await q.query(`ALTER TABLE \`organisation\` DROP COLUMN \`historianStatusWords\``);
  }
}
