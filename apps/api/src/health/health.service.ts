import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { MailTransport } from '../mail/mail-transport.js';
import { VERSION } from '../version.js';
import type { HealthResponse } from './health.response.js';

@Injectable()
export class HealthService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly mail: MailTransport,
  ) {}

  async check(): Promise<HealthResponse> {
    const [database, mail] = await Promise.all([this.databaseUp(), this.mail.ping()]);
    return {
      status: database && mail ? 'ok' : 'degraded',
      database: database ? 'up' : 'down',
      mail: mail ? 'up' : 'down',
      version: VERSION,
    };
  }

  private async databaseUp(): Promise<boolean> {
    try {
      await this.dataSource.query('SELECT 1');
      return true;
    } catch {
      return false;
    }
  }
}
