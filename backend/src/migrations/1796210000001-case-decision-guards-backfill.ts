import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Fills the new case columns from what is known: the submitter and the members who changed a case since its last
 * decision from the audit log, the names at submission from the current names (the best there is).
 */
export class CaseDecisionGuardsBackfill1796210000001 implements MigrationInterface {
  name = 'CaseDecisionGuardsBackfill1796210000001';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `UPDATE cleaning_case c SET c.submittedById = (SELECT a.userId FROM audit_event a WHERE a.entityId = c.id AND a.action = 'case.submitted' ORDER BY a.createdAt DESC LIMIT 1) WHERE c.submittedAt IS NOT NULL`,
    );
    await q.query(
      `UPDATE cleaning_case c SET c.lastEditedById = (SELECT a.userId FROM audit_event a WHERE a.entityId = c.id AND a.action = 'case.updated' ORDER BY a.createdAt DESC LIMIT 1)`,
    );
    await q.query(
      `UPDATE cleaning_case c SET c.editorIdsSinceDecision = (SELECT JSON_ARRAYAGG(DISTINCT a.userId) FROM audit_event a WHERE a.entityId = c.id AND a.action = 'case.updated' AND a.userId IS NOT NULL AND (c.decidedAt IS NULL OR a.createdAt > c.decidedAt))`,
    );
    await q.query(
      `UPDATE cleaning_case c JOIN generating_unit u ON u.id = c.unitId JOIN plant p ON p.id = u.plantId SET c.unitNameAtSubmit = u.name, c.plantNameAtSubmit = p.name WHERE c.submittedAt IS NOT NULL`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(
      `UPDATE cleaning_case SET submittedById = NULL, lastEditedById = NULL, editorIdsSinceDecision = NULL, unitNameAtSubmit = NULL, plantNameAtSubmit = NULL`,
    );
  }
}
