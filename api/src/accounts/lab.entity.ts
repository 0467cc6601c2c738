import { Column, CreateDateColumn, Entity, OneToMany, PrimaryGeneratedColumn } from 'typeorm';
import type { Membership } from './membership.entity';

/** A research group: everything in Provenote belongs to exactly one lab. */
@Entity('labs')
export class Lab {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  name: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @OneToMany('Membership', (membership: Membership) => membership.lab)
  memberships: Membership[];
}
