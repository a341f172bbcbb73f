import type { MigrationInterface, QueryRunner } from 'typeorm';

export class CleaningCases1796200402325 implements MigrationInterface {
  name = 'CleaningCases1796200402325';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE \`cleaning_case\` (\`id\` uuid NOT NULL, \`organisationId\` uuid NOT NULL, \`unitId\` uuid NOT NULL, \`title\` varchar(120) NOT NULL, \`status\` varchar(16) NOT NULL, \`authorId\` uuid NOT NULL, \`inputs\` json NOT NULL, \`inputSources\` json NOT NULL, \`results\` json NOT NULL, \`engineVersion\` varchar(32) NOT NULL, \`currency\` char(3) NOT NULL, \`lastDataDay\` date NULL, \`setupVersion\` int NOT NULL, \`copiedFromId\` uuid NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updatedAt\` datetime(3) NOT NULL, \`submittedAt\` datetime(3) NULL, \`decidedAt\` datetime(3) NULL, \`archivedAt\` datetime(3) NULL, \`decidedById\` uuid NULL, \`returnReason\` varchar(2000) NULL, INDEX \`IDX_e6f922b8807ba99e24cfea7b29\` (\`unitId\`), INDEX \`IDX_bc32ef986dc9d32b98559aa97f\` (\`organisationId\`, \`status\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`case_comment\` (\`id\` uuid NOT NULL, \`organisationId\` uuid NOT NULL, \`caseId\` uuid NOT NULL, \`authorId\` uuid NULL, \`text\` varchar(4000) NOT NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`IDX_2d415c0c1a476a32e1958e1738\` (\`caseId\`, \`createdAt\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `ALTER TABLE \`cleaning_case\` ADD CONSTRAINT \`FK_28f05994e079921335d3a34ab62\` FOREIGN KEY (\`organisationId\`) REFERENCES \`organisation\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`cleaning_case\` ADD CONSTRAINT \`FK_e6f922b8807ba99e24cfea7b296\` FOREIGN KEY (\`unitId\`) REFERENCES \`generating_unit\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`case_comment\` ADD CONSTRAINT \`FK_08907d0c3300311c19087aac217\` FOREIGN KEY (\`caseId\`) REFERENCES \`cleaning_case\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`case_comment\` DROP FOREIGN KEY \`FK_08907d0c3300311c19087aac217\``);
    await q.query(`ALTER TABLE \`cleaning_case\` DROP FOREIGN KEY \`FK_e6f922b8807ba99e24cfea7b296\``);
    await q.query(`ALTER TABLE \`cleaning_case\` DROP FOREIGN KEY \`FK_28f05994e079921335d3a34ab62\``);
    await q.query(`DROP INDEX \`IDX_2d415c0c1a476a32e1958e1738\` ON \`case_comment\``);
    await q.query(`DROP TABLE \`case_comment\``);
    await q.query(`DROP INDEX \`IDX_bc32ef986dc9d32b98559aa97f\` ON \`cleaning_case\``);
    await q.query(`DROP INDEX \`IDX_e6f922b8807ba99e24cfea7b29\` ON \`cleaning_case\``);
    await q.query(`DROP TABLE \`cleaning_case\``);
  }
}
