// The audit trail: who changed what on a package (status, assignment, decision, file)
// and administrative changes such as review policies.
import { Column, CreateDateColumn, Entity, ForeignKey, Index, PrimaryGeneratedColumn } from 'typeorm';
import { LiftPackage } from '../packages/package.entity';
import { User } from '../users/user.entity';
import { Organisation } from '../organisations/organisation.entity';

@Index('audit_events_actor_idx', ['actorId'])
@Index('audit_events_organisation_idx', ['organisationId'])
@Entity({ name: 'audit_events' })
@Index('audit_events_package_idx', ['packageId', 'createdAt'])
export class AuditEvent {
  @PrimaryGeneratedColumn('uuid') id: string;
  @ForeignKey(() => LiftPackage, { name: 'audit_events_package_id_fkey', onDelete: 'CASCADE' })
  @Column({ type: 'uuid', name: 'package_id', nullable: true })
  packageId: string | null;
  @ForeignKey(() => Organisation, { name: 'audit_events_organisation_id_fkey', onDelete: 'SET NULL' })
  @Column({ type: 'uuid', name: 'organisation_id', nullable: true })
  organisationId: string | null;
  @ForeignKey(() => User, { name: 'audit_events_actor_id_fkey', onDelete: 'SET NULL' })
  @Column({ type: 'uuid', name: 'actor_id', nullable: true })
  actorId: string | null;
  @Column({ type: 'varchar', length: 60 }) action: string;
  @Column({ type: 'jsonb', default: {} }) detail: Record<string, unknown>;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
}
