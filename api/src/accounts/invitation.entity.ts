import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { LabRole } from '@provenote/shared';
import type { Lab } from './lab.entity';
import type { User } from './user.entity';

/**
 * An invitation to join a lab with a role. The link's secret is stored only as its SHA-256; resending
 * replaces it, so only the newest link works.
 */
@Entity('invitations')
@Index('invitations_lab_email_idx', ['labId', 'email'])
export class Invitation {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'lab_id', type: 'uuid' })
  labId: string;

  /** Lower-cased. */
  @Column({ type: 'text' })
  email: string;

  @Column({ type: 'text' })
  role: LabRole;

  @Index('invitations_token_hash_key', { unique: true })
  @Column({ name: 'token_hash', type: 'text' })
  tokenHash: string;

  @Column({ name: 'invited_by', type: 'uuid', nullable: true })
  invitedById: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @Column({ name: 'sent_at', type: 'timestamptz' })
  sentAt: Date;

  @Column({ name: 'expires_at', type: 'timestamptz' })
  expiresAt: Date;

  @Column({ name: 'accepted_at', type: 'timestamptz', nullable: true })
  acceptedAt: Date | null;

  @Column({ name: 'revoked_at', type: 'timestamptz', nullable: true })
  revokedAt: Date | null;

  @ManyToOne('Lab', { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'lab_id' })
  lab: Lab;

  @ManyToOne('User', { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'invited_by' })
  invitedBy: User | null;
}
