import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Tenants, users, memberships, audit events and the session store table. */
export class Foundation1764633600000 implements MigrationInterface {
  name = 'Foundation1764633600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE organisation (
      id char(36) NOT NULL PRIMARY KEY,
      name varchar(160) NOT NULL,
      kind varchar(16) NOT NULL DEFAULT 'utility',
      plan varchar(32) NOT NULL DEFAULT 'trial',
      subscriptionStatus varchar(16) NOT NULL DEFAULT 'trialing',
      trialEndsAt datetime(3) NULL,
      stripeCustomerId varchar(64) NULL,
      stripeSubscriptionId varchar(64) NULL,
      createdAt datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3)
    ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await q.query(`CREATE TABLE user (
      id char(36) NOT NULL PRIMARY KEY,
      email varchar(254) NOT NULL,
      name varchar(120) NOT NULL,
      passwordHash varchar(255) NULL,
      googleSub varchar(64) NULL,
      unitPreference varchar(2) NOT NULL DEFAULT 'us',
      sessionsValidFrom datetime(3) NULL,
      createdAt datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      UNIQUE KEY uq_user_email (email),
      UNIQUE KEY uq_user_google (googleSub)
    ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await q.query(`CREATE TABLE membership (
      id char(36) NOT NULL PRIMARY KEY,
      organisationId char(36) NOT NULL,
      userId char(36) NOT NULL,
      role varchar(16) NOT NULL,
      clientGroupIds json NULL,
      createdAt datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      UNIQUE KEY uq_membership (organisationId, userId),
      KEY ix_membership_user (userId),
      CONSTRAINT fk_membership_org FOREIGN KEY (organisationId) REFERENCES organisation (id) ON DELETE CASCADE,
      CONSTRAINT fk_membership_user FOREIGN KEY (userId) REFERENCES user (id) ON DELETE CASCADE
    ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await q.query(`CREATE TABLE audit_event (
      id char(36) NOT NULL PRIMARY KEY,
      organisationId char(36) NOT NULL,
      userId char(36) NULL,
      action varchar(64) NOT NULL,
      entityType varchar(64) NOT NULL,
      entityId varchar(64) NULL,
      details json NULL,
      createdAt datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      KEY ix_audit_org_time (organisationId, createdAt),
      CONSTRAINT fk_audit_org FOREIGN KEY (organisationId) REFERENCES organisation (id) ON DELETE CASCADE
    ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    // Table layout expected by express-mysql-session (createDatabaseTable is off).
    await q.query(`CREATE TABLE sessions (
      session_id varchar(128) CHARACTER SET utf8mb4 COLLATE utf8mb4_bin NOT NULL PRIMARY KEY,
      expires int(11) unsigned NOT NULL,
      data mediumtext CHARACTER SET utf8mb4 COLLATE utf8mb4_bin
    ) ENGINE=InnoDB`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE sessions');
    await q.query('DROP TABLE audit_event');
    await q.query('DROP TABLE membership');
    await q.query('DROP TABLE user');
    await q.query('DROP TABLE organisation');
  }
}
