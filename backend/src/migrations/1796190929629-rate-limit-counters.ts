import type { MigrationInterface, QueryRunner } from 'typeorm';

export class RateLimitCounters1796190929629 implements MigrationInterface {
  name = 'RateLimitCounters1796190929629';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE \`rate_limit_counter\` (\`key\` varchar(128) NOT NULL, \`points\` int NOT NULL DEFAULT '0', \`expire\` bigint UNSIGNED NULL, PRIMARY KEY (\`key\`)) ENGINE=InnoDB`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE \`rate_limit_counter\``);
  }
}
