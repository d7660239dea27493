// The audit trail: who changed what on a package (status, assignment, decision, file)
// and administrative changes such as review policies.
import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

@Entity({ name: 'audit_events' })
export class AuditEvent {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'package_id', nullable: true }) packageId: string | null;
  @Column({ type: 'uuid', name: 'organisation_id', nullable: true }) organisationId: string | null;
  @Column({ type: 'uuid', name: 'actor_id', nullable: true }) actorId: string | null;
  @Column({ type: 'varchar', length: 60 }) action: string;
  @Column({ type: 'jsonb', default: () => "'{}'::jsonb" }) detail: Record<string, unknown>;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
}
