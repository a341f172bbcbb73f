import type { MigrationInterface, QueryRunner } from 'typeorm';

export class TenantsAndUsers1796163844986 implements MigrationInterface {
  name = 'TenantsAndUsers1796163844986';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE \`organisation\` (\`id\` uuid NOT NULL, \`name\` varchar(160) NOT NULL, \`kind\` varchar(16) NOT NULL DEFAULT 'utility', \`plan\` varchar(32) NOT NULL DEFAULT 'trial', \`subscriptionStatus\` varchar(16) NOT NULL DEFAULT 'trialing', \`trialEndsAt\` datetime(3) NULL, \`stripeCustomerId\` varchar(64) NULL, \`stripeSubscriptionId\` varchar(64) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`audit_event\` (\`id\` uuid NOT NULL, \`organisationId\` uuid NOT NULL, \`userId\` uuid NULL, \`action\` varchar(64) NOT NULL, \`entityType\` varchar(64) NOT NULL, \`entityId\` varchar(64) NULL, \`details\` json NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), INDEX \`IDX_906186a0622dea20a286ef884e\` (\`organisationId\`, \`createdAt\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`user\` (\`id\` uuid NOT NULL, \`email\` varchar(254) NOT NULL, \`name\` varchar(120) NOT NULL, \`passwordHash\` varchar(255) NULL, \`googleSub\` varchar(64) NULL, \`unitPreference\` varchar(2) NOT NULL DEFAULT 'us', \`sessionsValidFrom\` datetime(3) NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_e12875dfb3b1d92d7d7c5377e2\` (\`email\`), UNIQUE INDEX \`IDX_1132e9fb7a2bb725a1fed6996c\` (\`googleSub\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `CREATE TABLE \`membership\` (\`id\` uuid NOT NULL, \`organisationId\` uuid NOT NULL, \`userId\` uuid NOT NULL, \`role\` varchar(16) NOT NULL, \`clientGroupIds\` json NULL, \`createdAt\` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), UNIQUE INDEX \`IDX_73cdd42ee4b4240520cde81c26\` (\`organisationId\`, \`userId\`), PRIMARY KEY (\`id\`)) ENGINE=InnoDB`,
    );
    await q.query(
      `ALTER TABLE \`audit_event\` ADD CONSTRAINT \`FK_9a4df8f81241f672fa8f9b6c248\` FOREIGN KEY (\`organisationId\`) REFERENCES \`organisation\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`membership\` ADD CONSTRAINT \`FK_068c70de6a3c521f9352708fada\` FOREIGN KEY (\`organisationId\`) REFERENCES \`organisation\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await q.query(
      `ALTER TABLE \`membership\` ADD CONSTRAINT \`FK_eef2d9d9c70cd13bed868afedf4\` FOREIGN KEY (\`userId\`) REFERENCES \`user\`(\`id\`) ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE \`membership\` DROP FOREIGN KEY \`FK_eef2d9d9c70cd13bed868afedf4\``);
    await q.query(`ALTER TABLE \`membership\` DROP FOREIGN KEY \`FK_068c70de6a3c521f9352708fada\``);
    await q.query(`ALTER TABLE \`audit_event\` DROP FOREIGN KEY \`FK_9a4df8f81241f672fa8f9b6c248\``);
    await q.query(`DROP INDEX \`IDX_73cdd42ee4b4240520cde81c26\` ON \`membership\``);
    await q.query(`DROP TABLE \`membership\``);
    await q.query(`DROP INDEX \`IDX_1132e9fb7a2bb725a1fed6996c\` ON \`user\``);
    await q.query(`DROP INDEX \`IDX_e12875dfb3b1d92d7d7c5377e2\` ON \`user\``);
    await q.query(`DROP TABLE \`user\``);
    await q.query(`DROP INDEX \`IDX_906186a0622dea20a286ef884e\` ON \`audit_event\``);
    await q.query(`DROP TABLE \`audit_event\``);
    await q.query(`DROP TABLE \`organisation\``);
  }
}
