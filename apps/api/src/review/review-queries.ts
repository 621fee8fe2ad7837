/**
 * SQL the review services share. Automatic conflicts are computed here from the live team
 * (never stored), so they follow the team as it changes.
 */

const norm = (column: string) => `lower(btrim(${column}))`;

/**
 * Whether referee `refereeSql` (an expression giving a users row alias with id, email,
 * affiliation) is in conflict with proposal `proposalSql` through its team: on it (as a member or
 * an invitation to their address), or sharing an affiliation with a member.
 */
export const autoConflictSql = (referee: string, proposal: string) => `EXISTS (
  SELECT 1 FROM proposal_members m LEFT JOIN users mu ON mu.id = m.user_id
   WHERE m.proposal_id = ${proposal}
     AND (m.user_id = ${referee}.id
          OR (m.user_id IS NULL AND lower(m.email) = lower(${referee}.email))
          OR (mu.id IS NOT NULL AND ${norm(`${referee}.affiliation`)} <> ''
              AND ${norm('mu.affiliation')} = ${norm(`${referee}.affiliation`)})))`;

/**
 * Every conflict of the call's pool ($1 the call's id): automatic (team or affiliation) and
 * declared, one row per referee and proposal, a declaration first.
 */
export const POOL_CONFLICTS_SQL = `
  WITH pool AS (
    SELECT u.id, u.email, u.affiliation FROM call_roles r JOIN users u ON u.id = r.user_id
     WHERE r.call_id = $1 AND r.role = 'referee'),
  props AS (
    SELECT id, reference FROM proposals
     WHERE call_id = $1 AND status IN ('submitted', 'under_review'))
  SELECT DISTINCT ON (x.referee_id, x.proposal_id) x.referee_id, x.proposal_id, p.reference,
         x.kind, x.reason
    FROM (
      SELECT d.referee_id, d.proposal_id, 'declared' AS kind, d.reason, 0 AS rank
        FROM referee_conflicts d JOIN pool ON pool.id = d.referee_id
      UNION ALL
      SELECT pool.id, m.proposal_id,
             CASE WHEN m.user_id = pool.id OR (m.user_id IS NULL AND lower(m.email) = lower(pool.email))
                  THEN 'team' ELSE 'affiliation' END,
             CASE WHEN m.user_id = pool.id OR (m.user_id IS NULL AND lower(m.email) = lower(pool.email))
                  THEN 'On the proposal''s team'
                  ELSE 'Shares an affiliation with a member of the team' END,
             CASE WHEN m.user_id = pool.id THEN 1 ELSE 2 END
        FROM pool
        JOIN proposal_members m ON m.proposal_id IN (SELECT id FROM props)
        LEFT JOIN users mu ON mu.id = m.user_id
       WHERE m.user_id = pool.id
          OR (m.user_id IS NULL AND lower(m.email) = lower(pool.email))
          OR (mu.id IS NOT NULL AND ${norm('pool.affiliation')} <> ''
              AND ${norm('mu.affiliation')} = ${norm('pool.affiliation')})
    ) x
    JOIN props p ON p.id = x.proposal_id
   ORDER BY x.referee_id, x.proposal_id, x.rank`;
