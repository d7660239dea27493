// The review's records: engineer assignments, findings, markups on PDF pages, decisions
// and the stamped returns issued from them.
import {
  Column,
  CreateDateColumn,
  Entity,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
  VersionColumn,
} from 'typeorm';
import type { Decision } from '@shared/schemas/common';

@Entity({ name: 'assignments' })
export class Assignment {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'package_id' }) packageId: string;
  @Column({ type: 'uuid', name: 'engineer_id' }) engineerId: string;
  @Column({ type: 'uuid', name: 'assigned_by_id' }) assignedById: string;
  @CreateDateColumn({ type: 'timestamptz', name: 'assigned_at' }) assignedAt: Date;
  @Column({ type: 'timestamptz', name: 'ended_at', nullable: true }) endedAt: Date | null;
}

@Entity({ name: 'findings' })
export class Finding {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'package_id' }) packageId: string;
  @Column({ type: 'uuid', name: 'revision_id' }) revisionId: string;
  @Column({ type: 'varchar', length: 40, name: 'check_id', nullable: true }) checkId: string | null;
  @Column({ type: 'uuid', name: 'markup_id', nullable: true }) markupId: string | null;
  @Column({ type: 'uuid', name: 'file_id', nullable: true }) fileId: string | null;
  @Column({ type: 'int', name: 'page_number', nullable: true }) pageNumber: number | null;
  @Column({ type: 'text' }) text: string;
  @Column({ type: 'varchar', length: 20 }) severity: 'note' | 'minor' | 'major' | 'blocking';
  @Column({ type: 'varchar', length: 20, default: 'open' }) state: 'open' | 'answered' | 'closed';
  @Column({ type: 'text', nullable: true }) response: string | null;
  @Column({ type: 'uuid', name: 'created_by_id' }) createdById: string;
  @Column({ type: 'timestamptz', name: 'answered_at', nullable: true }) answeredAt: Date | null;
  @Column({ type: 'timestamptz', name: 'closed_at', nullable: true }) closedAt: Date | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' }) updatedAt: Date;
}

@Entity({ name: 'markups' })
export class Markup {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'revision_id' }) revisionId: string;
  @Column({ type: 'uuid', name: 'file_id' }) fileId: string;
  @Column({ type: 'int', name: 'page_number' }) pageNumber: number;
  @Column({ type: 'varchar', length: 20 }) kind: 'rectangle' | 'ellipse' | 'cloud' | 'arrow' | 'text' | 'pin';
  /** Geometry in PDF page coordinates (points, origin bottom-left). */
  @Column({ type: 'jsonb' }) geometry: Record<string, unknown>;
  @Column({ type: 'varchar', length: 20 }) colour: string;
  @Column({ type: 'text', nullable: true }) text: string | null;
  @Column({ type: 'int', nullable: true }) number: number | null;
  @Column({ type: 'uuid', name: 'created_by_id' }) createdById: string;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
}

@Entity({ name: 'decisions' })
export class DecisionRecord {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'package_id' }) packageId: string;
  @Column({ type: 'uuid', name: 'revision_id' }) revisionId: string;
  @Column({ type: 'varchar', length: 30 }) decision: Decision;
  @Column({ type: 'text', default: '' }) conditions: string;
  @Column({ type: 'uuid', name: 'engineer_id' }) engineerId: string;
  @VersionColumn({ type: 'int' }) version: number;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
}

@Entity({ name: 'stamped_returns' })
export class StampedReturn {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'decision_id' }) decisionId: string;
  @Column({ type: 'uuid', name: 'package_id' }) packageId: string;
  @Column({ type: 'uuid', name: 'revision_id' }) revisionId: string;
  @Column({ type: 'varchar', length: 64, name: 'verification_code' }) verificationCode: string;
  @Column({ type: 'varchar', length: 20, default: 'pending' }) state: 'pending' | 'ready' | 'failed';
  @Column({ type: 'char', length: 64, nullable: true }) sha256: string | null;
  @Column({ type: 'char', length: 64, name: 'signing_certificate_sha256', nullable: true })
  signingCertificateSha256: string | null;
  @Column({ type: 'varchar', length: 300, name: 'storage_key', nullable: true }) storageKey: string | null;
  @Column({ type: 'uuid', name: 'issued_by_id' }) issuedById: string;
  @Column({ type: 'int', default: 0 }) progress: number;
  @Column({ type: 'varchar', length: 500, nullable: true }) error: string | null;
  @Column({ type: 'int', nullable: true }) pages: number | null;
  @Column({ type: 'timestamptz', name: 'ready_at', nullable: true }) readyAt: Date | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
}
