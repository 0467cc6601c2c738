import { Column, CreateDateColumn, Entity, Index, OneToMany, PrimaryGeneratedColumn } from 'typeorm';
import type { Membership } from './membership.entity';

@Entity('users')
export class User {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** Stored lower-cased; unique across the installation. */
  @Index('users_email_key', { unique: true })
  @Column({ type: 'text' })
  email: string;

  @Column({ name: 'display_name', type: 'text' })
  displayName: string;

  /** bcrypt hash; null for an account created by an invitation that was not accepted yet. */
  @Column({ name: 'password_hash', type: 'text', nullable: true })
  passwordHash: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @OneToMany('Membership', (membership: Membership) => membership.user)
  memberships: Membership[];
}
