import { Global, Module } from '@nestjs/common';
import { MailService } from './mail.service';
import { OutboxController } from './outbox.controller';

/** Global: any feature may send mail (the run queue mails the person who started a run when it ends). */
@Global()
@Module({
  controllers: [OutboxController],
  providers: [MailService],
  exports: [MailService],
})
export class MailModule {}
