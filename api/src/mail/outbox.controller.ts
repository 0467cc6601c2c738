import { Controller, Get, NotFoundException, Param } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { OutboxMail } from '@provenote/shared';
import { Roles } from '../auth/roles.decorator';
import { MailService } from './mail.service';

@ApiTags('mail')
@Controller('labs/:labId/outbox')
export class OutboxController {
  constructor(private readonly mail: MailService) {}

  /**
   * The local fake server's mails sent on this lab's behalf (invitations, finished runs), so a PI of a
   * local installation can follow invitation links. Personal mails (password resets, sign-up links) are
   * not shown: a PI who could read them could take over a member's account. No outbox with a real server.
   */
  @Roles('pi')
  @Get()
  list(@Param('labId') labId: string): OutboxMail[] {
    const embedded = this.mail.embedded;
    if (!embedded) throw new NotFoundException('The outbox exists only in the local (embedded) mail mode');
    return embedded
      .list()
      .filter((mail) => mail.labId === labId)
      .map(({ id, receivedAt, from, to, subject, text }) => ({
        id,
        receivedAt: receivedAt.toISOString(),
        from,
        to,
        subject,
        text,
      }));
  }
}
