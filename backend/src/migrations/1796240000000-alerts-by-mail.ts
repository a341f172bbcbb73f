import type { MigrationInterface, QueryRunner } from 'typeorm';

/** E-mail alert choices per person (and unit) and the record of each alert told, which keeps it to one mail until it clears. */
export class AlertsByMail1796240000000 implements MigrationInterface {
  name = 'AlertsByMail1796240000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE \`alert_state\` (\`id\` uuid NOT NULL, \`organisationId\` uuid NOT NULL, \`unitId\` uuid NOT NULL, \`membershipId\` uuid NOT NULL, \`kind\` varchar(32) NOT NULL, \`raisedAt\` datetime(3) NOT NULL, \`clearedAt\` datetime(3) NULL, \`lastSentAt\` datetime(3) NULL, INDEX \`IDX_969fd4891ff5d05fa7c91e91c7\` (\`organisationId\`, \`unitId\`), UNIQUE INDEX \`IDX_45b0023ff336f98ae5001471dd\` (\`membershipId\`, \`unitId\`, \`kind\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`alert_subscription\` (\`id\` uuid NOT NULL, \`organisationId\` uuid NOT NULL, \`membershipId\` uuid NOT NULL, \`userId\` uuid NOT NULL, \`unitId\` uuid NULL, \`kinds\` json NOT NULL, \`dataStoppedDays\` int NOT NULL DEFAULT '3', \`weeklyDigest\` tinyint NOT NULL DEFAULT 0, \`digestWeek\` varchar(8) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), \`updatedAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3), INDEX \`IDX_00cec492ef34232985b41b5c1b\` (\`organisationId\`), UNIQUE INDEX \`IDX_c27a7e2d527f695a8c7f122f8f\` (\`membershipId\`, \`unitId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `ALTER TABLE \`alert_state\` ADD CONSTRAINT \`FK_407c8024c5b32e6ebc5bb7e8df7\` FOREIGN KEY (\`membershipId\`) REFERENCES \`membership\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`alert_state\` ADD CONSTRAINT \`FK_4c33d5bc119195393f6ff574042\` FOREIGN KEY (\`unitId\`) REFERENCES \`generating_unit\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`alert_subscription\` ADD CONSTRAINT \`FK_3c8c30a714f378ae267545f97b9\` FOREIGN KEY (\`membershipId\`) REFERENCES \`membership\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`alert_subscription\` ADD CONSTRAINT \`FK_5e018594e50d496f6228d20f635\` FOREIGN KEY (\`unitId\`) REFERENCES \`generating_unit\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`alert_subscription\` DROP FOREIGN KEY \`FK_5e018594e50d496f6228d20f635\``);
    await q.query(`ALTER TABLE \`alert_subscription\` DROP FOREIGN KEY \`FK_3c8c30a714f378ae267545f97b9\``);
    await q.query(`ALTER TABLE \`alert_state\` DROP FOREIGN KEY \`FK_4c33d5bc119195393f6ff574042\``);
    await q.query(`ALTER TABLE \`alert_state\` DROP FOREIGN KEY \`FK_407c8024c5b32e6ebc5bb7e8df7\``);
    await q.query(`DROP INDEX \`IDX_c27a7e2d527f695a8c7f122f8f\` ON \`alert_subscription\``);
    await q.query(`DROP INDEX \`IDX_00cec492ef34232985b41b5c1b\` ON \`alert_subscription\``);
    await q.query(`DROP TABLE \`alert_subscription\``);
    await q.query(`DROP INDEX \`IDX_45b0023ff336f98ae5001471dd\` ON \`alert_state\``);
    await q.query(`DROP INDEX \`IDX_969fd4891ff5d05fa7c91e91c7\` ON \`alert_state\``);
    await q.query(`DROP TABLE \`alert_state\``);
  }
}
