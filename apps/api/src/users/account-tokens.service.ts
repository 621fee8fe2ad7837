import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { createHash, randomBytes } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import { AccountToken, type TokenPurpose } from './entities/account-token.entity.js';

/** How long an e-mailed link works. */
export const TOKEN_LIFETIME_MINUTES: Record<TokenPurpose, number> = {
  'verify-email': 48 * 60,
  'reset-password': 60,
};

export const hashToken = (token: string): string =>
  createHash('sha256').update(token, 'utf8').digest('hex');

/**
 * Single-use tokens for e-mailed links. The token itself (256 random bits, base64url) goes only
 * into the e-mail; the table keeps its SHA-256. Redeeming marks it used in the same statement that
 * checks it, so two concurrent redemptions cannot both succeed.
 */
@Injectable()
export class AccountTokensService {
  constructor(@InjectDataSource() private readonly dataSource: DataSource) {}

  /** Issues a fresh token and retires the account's earlier unused ones of the same purpose. */
  async issue(
    userId: string,
    purpose: TokenPurpose,
    manager: EntityManager = this.dataSource.manager,
  ): Promise<{ token: string; expiresAt: Date }> {
    await manager.query(
      `UPDATE account_tokens SET used_at = now()
        WHERE user_id = $1 AND purpose = $2 AND used_at IS NULL`,
      [userId, purpose],
    );
    const token = randomBytes(32).toString('base64url');
    const expiresAt = new Date(Date.now() + TOKEN_LIFETIME_MINUTES[purpose] * 60_000);
    await manager.insert(AccountToken, {
      userId,
      purpose,
      tokenHash: hashToken(token),
      expiresAt,
    });
    return { token, expiresAt };
  }

  /** The token's user id when it is unused and unexpired (and marks it used), else null. */
  async redeem(
    token: string,
    purpose: TokenPurpose,
    manager: EntityManager = this.dataSource.manager,
  ): Promise<string | null> {
    const [rows]: [{ user_id: string }[], number] = await manager.query(
      `UPDATE account_tokens SET used_at = now()
        WHERE token_hash = $1 AND purpose = $2 AND used_at IS NULL AND expires_at > now()
        RETURNING user_id`,
      [hashToken(token), purpose],
    );
    return rows[0]?.user_id ?? null;
  }
}
