// A person who signs in. token_version ends every session of a person when it changes.
import {
  Column,
  CreateDateColumn,
  Entity,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import type { Role, UnitSystem } from '@shared/schemas/common';
import { Organisation } from '../organisations/organisation.entity';

@Entity({ name: 'users' })
export class User {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'organisation_id' }) organisationId: string;
  @ManyToOne(() => Organisation, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'organisation_id' })
  organisation?: Organisation;
  @Column({ type: 'varchar', length: 254 }) email: string;
  @Column({ type: 'varchar', length: 200 }) name: string;
  @Column({ type: 'varchar', length: 20 }) role: Role;
  @Column({ type: 'varchar', length: 10, name: 'unit_system', default: 'metric' }) unitSystem: UnitSystem;
  @Column({ type: 'varchar', length: 100, name: 'password_hash', nullable: true }) passwordHash:
    string | null;
  @Column({ type: 'boolean', default: true }) active: boolean;
  @Column({ type: 'int', name: 'token_version', default: 0 }) tokenVersion: number;
  @Column({ type: 'boolean', name: 'notify_reminders', default: true }) notifyReminders: boolean;
  @Column({ type: 'char', length: 64, name: 'invite_token_hash', nullable: true }) inviteTokenHash:
    string | null;
  @Column({ type: 'timestamptz', name: 'invite_expires_at', nullable: true }) inviteExpiresAt: Date | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' }) updatedAt: Date;
}
