import { Injectable, type OnModuleDestroy } from '@nestjs/common';
import nodemailer, { type Transporter } from 'nodemailer';
import { AppConfig } from '../config/app-config.js';

/** nodemailer's SMTP transport, configured from the environment (the sink, or a real relay). */
@Injectable()
export class MailTransport implements OnModuleDestroy {
  readonly transporter: Transporter;

  constructor(private readonly config: AppConfig) {
    const user = config.get('MAIL_SMTP_USER');
    this.transporter = nodemailer.createTransport({
      host: config.get('MAIL_SMTP_HOST'),
      port: config.get('MAIL_SMTP_PORT'),
      secure: config.get('MAIL_SMTP_SECURE'),
      auth: user ? { user, pass: config.get('MAIL_SMTP_PASSWORD') ?? '' } : undefined,
      connectionTimeout: 5000,
      greetingTimeout: 5000,
      socketTimeout: 20000,
    });
  }

  get from(): string {
    return this.config.get('MAIL_FROM');
  }

  /** True when the SMTP server answers within the timeout. */
  async ping(timeoutMs = 2000): Promise<boolean> {
    const timeout = new Promise<boolean>((resolve) =>
      setTimeout(() => resolve(false), timeoutMs).unref(),
    );
    const check = this.transporter.verify().then(
      () => true,
      () => false,
    );
    return Promise.race([check, timeout]);
  }

  onModuleDestroy(): void {
    this.transporter.close();
  }
}
