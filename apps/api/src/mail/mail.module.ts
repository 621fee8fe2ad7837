import { Global, Module } from '@nestjs/common';
import { MailTransport } from './mail-transport.js';
import { MailService } from './mail.service.js';
import { OutboxWorker } from './outbox.worker.js';

@Global()
@Module({
  providers: [MailTransport, MailService, OutboxWorker],
  exports: [MailService, MailTransport, OutboxWorker],
})
export class MailModule {}
