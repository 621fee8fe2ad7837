import type { CheckLevel } from '@skyhours/calc';

export type DocumentFindingCode =
  'TEAM_NAME_IN_ANONYMOUS_PDF' | 'SCIENCE_CASE_TEXT_UNREADABLE' | 'SCIENCE_CASE_HAS_NO_TEXT';

/**
 * A finding about an uploaded document, shaped like the calculator's checks (level, code, field,
 * sentence) so the Checks section and the submission rule treat both alike: blockers stop a
 * submission, warnings do not.
 */
export interface DocumentFinding {
  level: CheckLevel;
  code: DocumentFindingCode;
  field: 'documents.scienceCase';
  message: string;
}
