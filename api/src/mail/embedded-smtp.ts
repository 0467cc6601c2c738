import { randomUUID } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export const LAB_HEADER = 'x-provenote-lab';
/** The fake keeps the newest mails only: it is a local convenience, not an archive. */
const KEEP = 500;

export interface ReceivedMail {
  id: string;
  receivedAt: Date;
  from: string;
  to: string[];
  subject: string;
  text: string;
  /** The lab the mail concerns (from the X-Provenote-Lab header), or null. */
  labId: string | null;
}

const addresses = (value: AddressObject | AddressObject[] | undefined): string[] =>
  (Array.isArray(value) ? value : value ? [value] : []).flatMap((group) =>
    group.value.map((entry) => entry.address ?? '').filter(Boolean),
  );

/**
 * A real SMTP server on loopback that accepts every mail and keeps it, parsed, in memory. Used in the
 * embedded mail mode (local installations and tests) so mails travel the same nodemailer path as in
 * production.
 */
export class EmbeddedSmtpServer {
  private readonly mails: ReceivedMail[] = [];
  private readonly waiters = new Set<() => void>();
  private readonly server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    onData: (stream, _session, callback) => {
      simpleParser(stream)
        .then((parsed) => {
          const lab = parsed.headers.get(LAB_HEADER);
          this.mails.push({
            id: randomUUID(),
            receivedAt: new Date(),
            from: addresses(parsed.from)[0] ?? '',
            to: addresses(parsed.to),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            labId: typeof lab === 'string' ? lab : null,
          });
          if (this.mails.length > KEEP) this.mails.splice(0, this.mails.length - KEEP);
          this.waiters.forEach((wake) => wake());
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });

  async start(): Promise<number> {
    await new Promise<void>((resolve, reject) => {
      this.server.once('error', reject);
      this.server.listen(0, '127.0.0.1', () => resolve());
    });
    return (this.server.server.address() as AddressInfo).port;
  }

  stop(): Promise<void> {
    return new Promise((resolve) => this.server.close(() => resolve()));
  }

  /** Newest first. */
  list(): ReceivedMail[] {
    return [...this.mails].reverse();
  }

  /** The first mail (oldest first) that matches, waiting for it to arrive. */
  async waitFor(match: (mail: ReceivedMail) => boolean, timeoutMs = 5000): Promise<ReceivedMail> {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const found = this.mails.find(match);
      if (found) return found;
      const remaining = deadline - Date.now();
      if (remaining <= 0) throw new Error(`No matching mail arrived within ${timeoutMs} ms`);
      await new Promise<void>((resolve) => {
        const wake = () => {
          this.waiters.delete(wake);
          clearTimeout(timer);
          resolve();
        };
        const timer = setTimeout(wake, remaining);
        this.waiters.add(wake);
      });
    }
  }
}
