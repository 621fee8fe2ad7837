import { HttpStatus, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import type { SessionUser } from '../auth/session-user.js';
import { AppError } from '../common/errors/app-error.js';
import { ProposalAccess } from '../proposals/proposal-access.service.js';
import { commentsToPi } from './publish.service.js';
import type { ProposalOutcome, Tier } from './standing-contract.js';
import { IN_STANDING_SQL } from './standing.service.js';

const round = (value: number) => Math.round(value * 1e6) / 1e6;

/**
 * A proposal's outcome as its team reads it: only its members (404 for anyone else, as for the
 * proposal itself), and only once the call is published (404 before: there is no outcome yet).
 */
@Injectable()
export class OutcomeService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly access: ProposalAccess,
  ) {}

  async forUser(user: SessionUser, reference: string): Promise<ProposalOutcome> {
    const { proposalId } = await this.access.membership(user, reference);
    const rows = (await this.dataSource.query(
      `SELECT p.reference, c.code, c.published_at, g.tier
         FROM proposals p
         JOIN calls c ON c.id = p.call_id
         LEFT JOIN proposal_grants g ON g.proposal_id = p.id
        WHERE p.id = $1 AND c.published_at IS NOT NULL
          AND c.status IN ('published', 'archived') AND ${IN_STANDING_SQL}`,
      [proposalId],
    )) as { reference: string; code: string; published_at: Date; tier: Tier | null }[];
    const row = rows[0];
    if (!row)
      throw new AppError(
        HttpStatus.NOT_FOUND,
        'OUTCOME_NOT_PUBLISHED',
        `The outcome of proposal ${reference.trim().toUpperCase()} is not published`,
      );
    const tier = row.tier ?? 'not_allocated';
    const observations = (await this.dataSource.query(
      `SELECT o.id, t.name AS target_name, cfg.name AS configuration_name, b.name AS band_name,
              o.hours_asked, COALESCE(og.hours, 0) AS hours_granted
         FROM proposal_observations o
         JOIN proposal_targets t ON t.id = o.target_id
         JOIN configurations cfg ON cfg.id = o.configuration_id
         JOIN receiver_bands b ON b.id = o.band_id
         LEFT JOIN observation_grants og ON og.observation_id = o.id
        WHERE o.proposal_id = $1
        ORDER BY o.position`,
      [proposalId],
    )) as {
      id: string;
      target_name: string;
      configuration_name: string;
      band_name: string;
      hours_asked: number;
      hours_granted: number;
    }[];
    const comments = (await this.dataSource.query(
      `SELECT comment_to_pi FROM review_assignments
        WHERE proposal_id = $1 AND status = 'submitted'`,
      [proposalId],
    )) as { comment_to_pi: string }[];
    const list = observations.map((o) => ({
      id: o.id,
      targetName: o.target_name,
      configurationName: o.configuration_name,
      bandName: o.band_name,
      hoursAsked: o.hours_asked,
      hoursGranted: tier === 'not_allocated' ? 0 : o.hours_granted,
    }));
    return {
      reference: row.reference,
      callCode: row.code,
      tier,
      hoursGranted: round(list.reduce((sum, o) => sum + o.hoursGranted, 0)),
      observations: list,
      comments: commentsToPi(comments.map((c) => c.comment_to_pi)),
      publishedAt: row.published_at.toISOString(),
    };
  }
}
