import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

export type MailTokenPurpose = 'sign_up' | 'password_reset';

/**
 * A one-time link sent by mail (confirming a sign-up, resetting a password). Only the SHA-256 of the
 * secret is stored; `used_at` makes it single-use and `expires_at` short-lived.
 */
@Entity('mail_tokens')
export class MailToken {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  purpose: MailTokenPurpose;

  @Index('mail_tokens_email_idx')
  @Column({ type: 'text' })
  email: string;

  @Index('mail_tokens_token_hash_key', { unique: true })
  @Column({ name: 'token_hash', type: 'text' })
  tokenHash: string;

  /** What the link completes: for a sign-up the name, lab name and password hash chosen. */
  @Column({ type: 'jsonb', default: () => "'{}'" })
  payload: Record<string, string>;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @Column({ name: 'expires_at', type: 'timestamptz' })
  expiresAt: Date;

  @Column({ name: 'used_at', type: 'timestamptz', nullable: true })
  usedAt: Date | null;
}
