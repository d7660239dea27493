// The review's records: engineer assignments, findings, markups on PDF pages, decisions
// and the stamped returns issued from them.
import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  ForeignKey,
  Index,
  PrimaryGeneratedColumn,
  Unique,
  UpdateDateColumn,
  VersionColumn,
} from 'typeorm';
import { LiftPackage } from '../packages/package.entity';
import { User } from '../users/user.entity';
import { UploadedFile } from '../files/file.entity';
import { Revision } from '../packages/package.entity';
import type { Decision, UnitSystem } from '@shared/schemas/common';

@Index('assignments_assigned_by_idx', ['assignedById'])
@Index('assignments_engineer_idx', ['engineerId'])
@Index('assignments_package_idx', ['packageId'])
@Entity({ name: 'assignments' })
export class Assignment {
  @PrimaryGeneratedColumn('uuid') id: string;
  @ForeignKey(() => LiftPackage, { name: 'assignments_package_id_fkey', onDelete: 'CASCADE' })
  @Column({ type: 'uuid', name: 'package_id' })
  packageId: string;
  @ForeignKey(() => User, { name: 'assignments_engineer_id_fkey' })
  @Column({ type: 'uuid', name: 'engineer_id' })
  engineerId: string;
  @ForeignKey(() => User, { name: 'assignments_assigned_by_id_fkey' })
  @Column({ type: 'uuid', name: 'assigned_by_id' })
  assignedById: string;
  @CreateDateColumn({ type: 'timestamptz', name: 'assigned_at' }) assignedAt: Date;
  @Column({ type: 'timestamptz', name: 'ended_at', nullable: true }) endedAt: Date | null;
  /** The coordinator's note to the engineer (migration AssignmentNote1764724200000). */
  @Column({ type: 'varchar', length: 500, nullable: true }) note: string | null;
}

@Index('findings_created_by_idx', ['createdById'])
@Index('findings_file_idx', ['fileId'])
@Index('findings_markup_idx', ['markupId'])
@Index('findings_revision_idx', ['revisionId'])
@Entity({ name: 'findings' })
@Index('findings_package_idx', ['packageId'])
export class Finding {
  @PrimaryGeneratedColumn('uuid') id: string;
  @ForeignKey(() => LiftPackage, { name: 'findings_package_id_fkey', onDelete: 'CASCADE' })
  @Column({ type: 'uuid', name: 'package_id' })
  packageId: string;
  @ForeignKey(() => Revision, { name: 'findings_revision_id_fkey', onDelete: 'CASCADE' })
  @Column({ type: 'uuid', name: 'revision_id' })
  revisionId: string;
  @Column({ type: 'varchar', length: 40, name: 'check_id', nullable: true }) checkId: string | null;
  @ForeignKey(() => Markup, { name: 'findings_markup_id_fkey', onDelete: 'SET NULL' })
  @Column({ type: 'uuid', name: 'markup_id', nullable: true })
  markupId: string | null;
  @ForeignKey(() => UploadedFile, { name: 'findings_file_id_fkey', onDelete: 'SET NULL' })
  @Column({ type: 'uuid', name: 'file_id', nullable: true })
  fileId: string | null;
  @Column({ type: 'int', name: 'page_number', nullable: true }) pageNumber: number | null;
  @Column({ type: 'text' }) text: string;
  @Column({ type: 'varchar', length: 20 }) severity: 'note' | 'minor' | 'major' | 'blocking';
  @Column({ type: 'varchar', length: 20, default: 'open' }) state: 'open' | 'answered' | 'closed';
  @Column({ type: 'text', nullable: true }) response: string | null;
  @ForeignKey(() => User, { name: 'findings_created_by_id_fkey' })
  @Column({ type: 'uuid', name: 'created_by_id' })
  createdById: string;
  @Column({ type: 'timestamptz', name: 'answered_at', nullable: true }) answeredAt: Date | null;
  @Column({ type: 'timestamptz', name: 'closed_at', nullable: true }) closedAt: Date | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' }) updatedAt: Date;
}

@Index('markups_created_by_idx', ['createdById'])
@Index('markups_file_idx', ['fileId'])
@Entity({ name: 'markups' })
@Check('markups_page_number_check', `(page_number >= 1)`)
@Index('markups_revision_idx', ['revisionId', 'fileId', 'pageNumber'])
export class Markup {
  @PrimaryGeneratedColumn('uuid') id: string;
  @ForeignKey(() => Revision, { name: 'markups_revision_id_fkey', onDelete: 'CASCADE' })
  @Column({ type: 'uuid', name: 'revision_id' })
  revisionId: string;
  @ForeignKey(() => UploadedFile, { name: 'markups_file_id_fkey', onDelete: 'CASCADE' })
  @Column({ type: 'uuid', name: 'file_id' })
  fileId: string;
  @Column({ type: 'int', name: 'page_number' }) pageNumber: number;
  @Column({ type: 'varchar', length: 20 }) kind: 'rectangle' | 'ellipse' | 'cloud' | 'arrow' | 'text' | 'pin';
  /** Geometry in PDF page coordinates (points, origin bottom-left). */
  @Column({ type: 'jsonb' }) geometry: Record<string, unknown>;
  @Column({ type: 'varchar', length: 20 }) colour: string;
  @Column({ type: 'text', nullable: true }) text: string | null;
  @Column({ type: 'int', nullable: true }) number: number | null;
  @ForeignKey(() => User, { name: 'markups_created_by_id_fkey' })
  @Column({ type: 'uuid', name: 'created_by_id' })
  createdById: string;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
}

@Index('decisions_engineer_idx', ['engineerId'])
@Index('decisions_revision_idx', ['revisionId'])
@Entity({ name: 'decisions' })
@Check(
  'decisions_decision_check',
  `decision IN ('accepted', 'accepted_as_noted', 'revise_and_resubmit', 'rejected')`,
)
@Index('decisions_package_idx', ['packageId', 'createdAt'])
export class DecisionRecord {
  @PrimaryGeneratedColumn('uuid') id: string;
  @ForeignKey(() => LiftPackage, { name: 'decisions_package_id_fkey', onDelete: 'CASCADE' })
  @Column({ type: 'uuid', name: 'package_id' })
  packageId: string;
  @ForeignKey(() => Revision, { name: 'decisions_revision_id_fkey', onDelete: 'CASCADE' })
  @Column({ type: 'uuid', name: 'revision_id' })
  revisionId: string;
  @Column({ type: 'varchar', length: 30 }) decision: Decision;
  @Column({ type: 'text', default: '' }) conditions: string;
  @ForeignKey(() => User, { name: 'decisions_engineer_id_fkey' })
  @Column({ type: 'uuid', name: 'engineer_id' })
  engineerId: string;
  @VersionColumn({ type: 'int', default: 1 }) version: number;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  /** Why an acceptance stands despite the items in `overridden`; null when nothing stood against it. */
  @Column({ type: 'text', name: 'override_reason', nullable: true }) overrideReason: string | null;
  /** The items that stood against the acceptance when it was made, in words. */
  @Column({ type: 'jsonb', default: [] }) overridden: string[];
  /** sha-256 of the canonical JSON of the revision's inputs and results the decision was made on. */
  @Column({ type: 'char', length: 64, name: 'inputs_sha256', nullable: true }) inputsSha256: string | null;
  @Column({ type: 'char', length: 64, name: 'results_sha256', nullable: true }) resultsSha256: string | null;
  @Column({ type: 'varchar', length: 40, name: 'engine_version', nullable: true })
  engineVersion: string | null;
  /** When the engineer's password confirmed the decision (null before the step-up existed). */
  @Column({ type: 'timestamptz', name: 'confirmed_at', nullable: true }) confirmedAt: Date | null;
}

@Index('stamped_returns_issued_by_idx', ['issuedById'])
@Index('stamped_returns_revision_idx', ['revisionId'])
@Entity({ name: 'stamped_returns' })
@Index('stamped_returns_package_idx', ['packageId', 'createdAt'])
@Unique('stamped_returns_decision_id_key', ['decisionId'])
@Unique('stamped_returns_verification_code_key', ['verificationCode'])
@Check('stamped_returns_unit_system_check', `unit_system IN ('metric', 'imperial')`)
export class StampedReturn {
  @PrimaryGeneratedColumn('uuid') id: string;
  @ForeignKey(() => DecisionRecord, { name: 'stamped_returns_decision_id_fkey', onDelete: 'CASCADE' })
  @Column({ type: 'uuid', name: 'decision_id' })
  decisionId: string;
  @ForeignKey(() => LiftPackage, { name: 'stamped_returns_package_id_fkey', onDelete: 'CASCADE' })
  @Column({ type: 'uuid', name: 'package_id' })
  packageId: string;
  @ForeignKey(() => Revision, { name: 'stamped_returns_revision_id_fkey', onDelete: 'CASCADE' })
  @Column({ type: 'uuid', name: 'revision_id' })
  revisionId: string;
  @Column({ type: 'varchar', length: 64, name: 'verification_code' }) verificationCode: string;
  @Column({ type: 'varchar', length: 20, default: 'pending' }) state: 'pending' | 'ready' | 'failed';
  @Column({ type: 'char', length: 64, nullable: true }) sha256: string | null;
  @Column({ type: 'char', length: 64, name: 'signing_certificate_sha256', nullable: true })
  signingCertificateSha256: string | null;
  @Column({ type: 'varchar', length: 300, name: 'storage_key', nullable: true }) storageKey: string | null;
  @ForeignKey(() => User, { name: 'stamped_returns_issued_by_id_fkey' })
  @Column({ type: 'uuid', name: 'issued_by_id' })
  issuedById: string;
  @Column({ type: 'int', default: 0 }) progress: number;
  @Column({ type: 'varchar', length: 500, nullable: true }) error: string | null;
  @Column({ type: 'int', nullable: true }) pages: number | null;
  /** The unit system of the whole document, fixed when the return is issued. */
  @Column({ type: 'varchar', length: 10, name: 'unit_system' }) unitSystem: UnitSystem;
  @Column({ type: 'timestamptz', name: 'ready_at', nullable: true }) readyAt: Date | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
}
