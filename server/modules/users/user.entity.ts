// A person who signs in. token_version ends every session of a person when it changes.
import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import type { Role, UnitSystem } from '@shared/schemas/common';
import { Organisation } from '../organisations/organisation.entity';

@Index('users_organisation_idx', ['organisationId'])
@Entity({ name: 'users' })
@Check('users_role_check', `role IN ('contractor', 'reviewer', 'engineer', 'admin')`)
@Check('users_unit_system_check', `unit_system IN ('metric', 'imperial')`)
@Index('users_invite_token_idx', ['inviteTokenHash'], {
  unique: true,
  where: `invite_token_hash IS NOT NULL`,
})
export class User {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'organisation_id' }) organisationId: string;
  @ManyToOne(() => Organisation, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'organisation_id', foreignKeyConstraintName: 'users_organisation_id_fkey' })
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
