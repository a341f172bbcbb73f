import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Cleaning cases record who changed and who submitted them (none of them decides), the unit's and plant's names
 * when submitted, and a unit with cases is no longer deleted with them (RESTRICT instead of CASCADE).
 */
export class CaseDecisionGuards1796210000000 implements MigrationInterface {
  name = 'CaseDecisionGuards1796210000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`cleaning_case\` DROP FOREIGN KEY \`FK_e6f922b8807ba99e24cfea7b296\``);
    await q.query(`ALTER TABLE \`cleaning_case\` ADD \`lastEditedById\` uuid NULL`);
    await q.query(`ALTER TABLE \`cleaning_case\` ADD \`editorIdsSinceDecision\` json NULL`);
    await q.query(`ALTER TABLE \`cleaning_case\` ADD \`submittedById\` uuid NULL`);
    await q.query(`ALTER TABLE \`cleaning_case\` ADD \`unitNameAtSubmit\` varchar(120) NULL`);
    await q.query(`ALTER TABLE \`cleaning_case\` ADD \`plantNameAtSubmit\` varchar(120) NULL`);
    await q.query(
      `ALTER TABLE \`cleaning_case\` ADD CONSTRAINT \`FK_e6f922b8807ba99e24cfea7b296\` FOREIGN KEY (\`unitId\`) REFERENCES \`generating_unit\`(\`id\`) ON DELETE RESTRICT ON UPDATE NO ACTION`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`cleaning_case\` DROP FOREIGN KEY \`FK_e6f922b8807ba99e24cfea7b296\``);
    await q.query(`ALTER TABLE \`cleaning_case\` DROP COLUMN \`plantNameAtSubmit\``);
    await q.query(`ALTER TABLE \`cleaning_case\` DROP COLUMN \`unitNameAtSubmit\``);
    await q.query(`ALTER TABLE \`cleaning_case\` DROP COLUMN \`submittedById\``);
    await q.query(`ALTER TABLE \`cleaning_case\` DROP COLUMN \`editorIdsSinceDecision\``);
    await q.query(`ALTER TABLE \`cleaning_case\` DROP COLUMN \`lastEditedById\``);
    await q.query(
      `ALTER TABLE \`cleaning_case\` ADD CONSTRAINT \`FK_e6f922b8807ba99e24cfea7b296\` FOREIGN KEY (\`unitId\`) REFERENCES \`generating_unit\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }
}
