import { Inject, Injectable, Logger, type OnApplicationShutdown, type OnModuleInit } from '@nestjs/common';
import nodemailer, { type Transporter } from 'nodemailer';
import { APP_CONFIG } from '../config/config.module';
import type { AppConfig } from '../config/config';
import { EmbeddedSmtpServer, LAB_HEADER } from './embedded-smtp';

export interface OutgoingMail {
  to: string;
  subject: string;
  /** Plain text; every mail must read well without HTML. */
  text: string;
  html?: string;
  /** The lab the mail concerns, so that lab's PI sees it in the local outbox. */
  labId?: string;
}

/**
 * Sends mail through nodemailer: to SMTP_URL in the smtp mode, to an in-process fake SMTP server in the
 * embedded mode (whose received mails the outbox page shows).
 */
@Injectable()
export class MailService implements OnModuleInit, OnApplicationShutdown {
  private readonly logger = new Logger(MailService.name);
  private transporter: Transporter | undefined;
  /** Set in the embedded mode only. */
  readonly embedded: EmbeddedSmtpServer | undefined;

  constructor(@Inject(APP_CONFIG) private readonly config: AppConfig) {
    if (config.MAIL_MODE === 'embedded') this.embedded = new EmbeddedSmtpServer();
  }

  async onModuleInit() {
    if (this.embedded) {
      const port = await this.embedded.start();
      // The fake offers no TLS; it listens on loopback only.
      this.transporter = nodemailer.createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true });
    } else {
      this.transporter = nodemailer.createTransport(this.config.SMTP_URL);
    }
  }

  async onApplicationShutdown() {
    this.transporter?.close();
    await this.embedded?.stop();
  }

  async send(mail: OutgoingMail): Promise<{ messageId: string }> {
    if (!this.transporter) throw new Error('MailService.send called before the mail module started');
    const info = await this.transporter.sendMail({
      from: this.config.MAIL_FROM,
      to: mail.to,
      subject: mail.subject,
      text: mail.text,
      html: mail.html,
      headers: mail.labId ? { [LAB_HEADER]: mail.labId } : undefined,
    });
    if (this.embedded && this.config.NODE_ENV !== 'test') {
      // Locally the console is the way back in for someone locked out (a reset link), so say what was sent.
      this.logger.log(`Mail to ${mail.to}: ${mail.subject}\n${mail.text}`);
    }
    return { messageId: info.messageId };
  }
}
