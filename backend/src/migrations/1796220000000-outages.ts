import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Outages: their units, candidate work items, saved scopes and the approved snapshot. */
export class Outages1796220000000 implements MigrationInterface {
  name = 'Outages1796220000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE \`outage\` (\`id\` uuid NOT NULL, \`organisationId\` uuid NOT NULL, \`name\` varchar(120) NOT NULL, \`startDate\` date NOT NULL, \`endDate\` date NOT NULL, \`budget\` decimal(15,2) NOT NULL, \`currency\` char(3) NOT NULL, \`status\` varchar(16) NOT NULL, \`planVersion\` int NOT NULL DEFAULT '1', \`version\` int NOT NULL DEFAULT '1', \`proposal\` json NULL, \`approved\` json NULL, \`approvedById\` uuid NULL, \`approvedAt\` datetime(3) NULL, \`createdById\` uuid NOT NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updatedAt\` datetime(3) NOT NULL, INDEX \`IDX_4e4e27b00b9419f9ec7c9d7335\` (\`organisationId\`, \`status\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`outage_item\` (\`id\` uuid NOT NULL, \`outageId\` uuid NOT NULL, \`unitId\` uuid NOT NULL, \`kind\` varchar(32) NOT NULL, \`title\` varchar(120) NOT NULL, \`cost\` decimal(15,2) NOT NULL, \`durationDays\` int NOT NULL, \`lane\` varchar(40) NOT NULL, \`benefitMoney\` decimal(15,2) NULL, \`cleanlinessRecovered\` double NULL, \`horizonDays\` int NULL, \`caseId\` uuid NULL, \`pricedBenefit\` decimal(15,2) NOT NULL, \`pricingMethod\` varchar(16) NOT NULL, \`pricingText\` varchar(1000) NOT NULL, \`needs\` json NOT NULL, \`forced\` varchar(3) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updatedAt\` datetime(3) NOT NULL, INDEX \`IDX_24dc0be8bc24e787ae1f763af5\` (\`unitId\`), INDEX \`IDX_fb8a9521406c47d8e57c031c8a\` (\`outageId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`outage_scope\` (\`id\` uuid NOT NULL, \`outageId\` uuid NOT NULL, \`name\` varchar(80) NOT NULL, \`itemIds\` json NOT NULL, \`createdById\` uuid NOT NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`IDX_337fae2dcbb1fc3877017465e7\` (\`outageId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`outage_unit\` (\`outageId\` uuid NOT NULL, \`unitId\` uuid NOT NULL, INDEX \`IDX_d01f7bda57c0b0e327a3564fc4\` (\`unitId\`), PRIMARY KEY (\`outageId\`, \`unitId\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `ALTER TABLE \`outage\` ADD CONSTRAINT \`FK_c4c057f664c3d48007b2206013b\` FOREIGN KEY (\`organisationId\`) REFERENCES \`organisation\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`outage_item\` ADD CONSTRAINT \`FK_fb8a9521406c47d8e57c031c8ab\` FOREIGN KEY (\`outageId\`) REFERENCES \`outage\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`outage_item\` ADD CONSTRAINT \`FK_24dc0be8bc24e787ae1f763af50\` FOREIGN KEY (\`unitId\`) REFERENCES \`generating_unit\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`outage_item\` ADD CONSTRAINT \`FK_7db236ac1de6054b70264b0267e\` FOREIGN KEY (\`caseId\`) REFERENCES \`cleaning_case\`(\`id\`) ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`outage_scope\` ADD CONSTRAINT \`FK_337fae2dcbb1fc3877017465e78\` FOREIGN KEY (\`outageId\`) REFERENCES \`outage\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`outage_unit\` ADD CONSTRAINT \`FK_4a30070d9836770791949b2b175\` FOREIGN KEY (\`outageId\`) REFERENCES \`outage\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`outage_unit\` ADD CONSTRAINT \`FK_d01f7bda57c0b0e327a3564fc4f\` FOREIGN KEY (\`unitId\`) REFERENCES \`generating_unit\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`outage_unit\` DROP FOREIGN KEY \`FK_d01f7bda57c0b0e327a3564fc4f\``);
    await q.query(`ALTER TABLE \`outage_unit\` DROP FOREIGN KEY \`FK_4a30070d9836770791949b2b175\``);
    await q.query(`ALTER TABLE \`outage_scope\` DROP FOREIGN KEY \`FK_337fae2dcbb1fc3877017465e78\``);
    await q.query(`ALTER TABLE \`outage_item\` DROP FOREIGN KEY \`FK_7db236ac1de6054b70264b0267e\``);
    await q.query(`ALTER TABLE \`outage_item\` DROP FOREIGN KEY \`FK_24dc0be8bc24e787ae1f763af50\``);
    await q.query(`ALTER TABLE \`outage_item\` DROP FOREIGN KEY \`FK_fb8a9521406c47d8e57c031c8ab\``);
    await q.query(`ALTER TABLE \`outage\` DROP FOREIGN KEY \`FK_c4c057f664c3d48007b2206013b\``);
    await q.query(`DROP INDEX \`IDX_d01f7bda57c0b0e327a3564fc4\` ON \`outage_unit\``);
    await q.query(`DROP TABLE \`outage_unit\``);
    await q.query(`DROP INDEX \`IDX_337fae2dcbb1fc3877017465e7\` ON \`outage_scope\``);
    await q.query(`DROP TABLE \`outage_scope\``);
    await q.query(`DROP INDEX \`IDX_fb8a9521406c47d8e57c031c8a\` ON \`outage_item\``);
    await q.query(`DROP INDEX \`IDX_24dc0be8bc24e787ae1f763af5\` ON \`outage_item\``);
    await q.query(`DROP TABLE \`outage_item\``);
    await q.query(`DROP INDEX \`IDX_4e4e27b00b9419f9ec7c9d7335\` ON \`outage\``);
    await q.query(`DROP TABLE \`outage\``);
  }
}
