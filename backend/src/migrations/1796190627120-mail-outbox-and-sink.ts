import type { MigrationInterface, QueryRunner } from 'typeorm';

export class MailOutboxAndSink1796190627120 implements MigrationInterface {
  name = 'MailOutboxAndSink1796190627120';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE \`mail_outbox\` (\`id\` uuid NOT NULL, \`kind\` varchar(32) NOT NULL, \`recipient\` varchar(254) NOT NULL, \`subject\` varchar(300) NOT NULL DEFAULT '', \`body\` text NULL, \`availableAt\` datetime(3) NOT NULL, \`attempts\` int NOT NULL DEFAULT '0', \`claimedBy\` varchar(100) NULL, \`claimedAt\` datetime(3) NULL, \`lastError\` varchar(500) NULL, \`failedAt\` datetime(3) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`IDX_d348d0b9f1a71b8254c14a6745\` (\`failedAt\`, \`availableAt\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`sink_message\` (\`id\` uuid NOT NULL, \`recipient\` varchar(254) NOT NULL, \`sender\` varchar(300) NOT NULL, \`subject\` varchar(300) NOT NULL, \`body\` mediumtext NOT NULL, \`receivedAt\` datetime(3) NOT NULL, INDEX \`IDX_9e8404138973528e14bcfaa27c\` (\`recipient\`, \`receivedAt\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX \`IDX_9e8404138973528e14bcfaa27c\` ON \`sink_message\``);
    await q.query(`DROP TABLE \`sink_message\``);
    await q.query(`DROP INDEX \`IDX_d348d0b9f1a71b8254c14a6745\` ON \`mail_outbox\``);
    await q.query(`DROP TABLE \`mail_outbox\``);
  }
}
