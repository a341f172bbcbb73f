import type { CaseComment } from '@shared/schemas/cases.js';

/** What a case report needs besides the case itself. */
export interface CaseReportContext {
  organisationName: string;
  /** when the report is made (shown in the footer, in the plant's time zone) */
  generatedAt: Date;
  /** the case's comment thread, oldest first */
  comments: CaseComment[];
}
