import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import type { RunEvent } from '@provenote/shared';
import { APP_CONFIG } from '../config/config.module';
import type { AppConfig } from '../config/config';

/** Whatever sends mail for the product; the runs module asks for it under RUN_MAILER. */
export interface RunMailer {
  send(message: { to: string; subject: string; text: string; labId?: string }): Promise<unknown>;
}
export const RUN_MAILER = Symbol('RUN_MAILER');

const CAUTION =
  'A membership probability is statistical evidence of how typical a sample is of a reference group, not proof of its origin.';

const KIND_LABELS: Record<string, string> = {
  classify: 'assignment',
  'group-check': 'group check',
  'robust-fit': 'robust fit',
  bundle: 'result bundle',
};

/** Tells the person who started a run that it ended, with a link to it. */
@Injectable()
export class RunEndedNotifier {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    @Inject(RUN_MAILER) private readonly mailer: RunMailer,
  ) {}

  async runEnded(event: RunEvent): Promise<void> {
    const rows = (await this.dataSource.query(
      `SELECT r.kind, r.lab_id, r.study_id, u.email FROM runs r JOIN users u ON u.id = r.created_by WHERE r.id = $1`,
      [event.runId],
    )) as { kind: string; lab_id: string; study_id: string | null; email: string }[];
    const row = rows[0];
    if (!row) return;
    // The run is shown on its study's page; a run without a study is listed on the lab's page.
    const path = row.study_id ? `/labs/${row.lab_id}/studies/${row.study_id}` : `/labs/${row.lab_id}`;
    const message = composeRunEndedMail(event, row.kind, `${this.config.PUBLIC_URL}${path}`);
    await this.mailer.send({ to: row.email, labId: row.lab_id, ...message });
  }
}

export function composeRunEndedMail(event: RunEvent, kind: string, link: string): { subject: string; text: string } {
  const what = KIND_LABELS[kind] ?? kind;
  const outcome =
    event.status === 'succeeded' ? 'has finished' : event.status === 'cancelled' ? 'was cancelled' : 'failed';
  const lines = [`Your ${what} run ${outcome}.`, ''];
  if (event.status === 'failed' && event.error) lines.push(`Reason: ${event.error}`, '');
  lines.push(`Open it: ${link}`);
  if (event.status === 'succeeded' && kind === 'classify') lines.push('', CAUTION);
  return { subject: `Provenote: ${what} run ${outcome}`, text: lines.join('\n') };
}
