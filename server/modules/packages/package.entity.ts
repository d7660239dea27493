// A lift package and its revisions. A revision's inputs and files freeze when it is
// submitted; the check run's results are stored against the revision.
import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  ForeignKey,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  Unique,
  UpdateDateColumn,
  VersionColumn,
} from 'typeorm';
import type { LiftResult } from '@shared/engineering/types';
import type { CheckStatus } from '@shared/schemas/packages';
import type { SitePolicy } from '@shared/schemas/site-policy';
import type { Decision, PackageStatus, UnitSystem } from '@shared/schemas/common';
import { Organisation } from '../organisations/organisation.entity';
import { Site } from '../sites/site.entity';
import { User } from '../users/user.entity';

@Index('lift_packages_created_by_idx', ['createdById'])
@Entity({ name: 'lift_packages' })
@Index('lift_packages_contractor_idx', ['contractorOrganisationId'])
@Index('lift_packages_engineer_idx', ['assignedEngineerId'])
@Index('lift_packages_site_status_idx', ['siteId', 'status', 'plannedLiftDate'])
// The queue's sorts, each ending in the tie-break (1764721000000-queue-at-scale). The planned lift
// date's two are on coalesce() expressions and the trigram ones are GIN indexes, which TypeORM's
// metadata cannot describe: named here with synchronize off so that it leaves them alone.
@Index('lift_packages_lift_date_asc_idx', { synchronize: false })
@Index('lift_packages_lift_date_desc_idx', { synchronize: false })
@Index('lift_packages_review_due_asc_idx', { synchronize: false })
@Index('lift_packages_review_due_desc_idx', { synchronize: false })
@Index('lift_packages_updated_idx', ['updatedAt', 'reference'])
@Index('lift_packages_discrepancies_idx', ['openDiscrepancies', 'reference'])
@Index('lift_packages_revision_idx', ['currentRevision', 'reference'])
@Index('lift_packages_reference_trgm_idx', { synchronize: false })
@Index('lift_packages_title_trgm_idx', { synchronize: false })
@Unique('lift_packages_reference_key', ['reference'])
@Check('lift_packages_unit_system_check', `unit_system IN ('metric', 'imperial')`)
export class LiftPackage {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'varchar', length: 30 }) reference: string;
  @Column({ type: 'varchar', length: 200 }) title: string;
  @Column({ type: 'uuid', name: 'contractor_organisation_id' }) contractorOrganisationId: string;
  @ManyToOne(() => Organisation)
  @JoinColumn({
    name: 'contractor_organisation_id',
    foreignKeyConstraintName: 'lift_packages_contractor_organisation_id_fkey',
  })
  contractor?: Organisation;
  @Column({ type: 'uuid', name: 'site_id' }) siteId: string;
  @ManyToOne(() => Site)
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'lift_packages_site_id_fkey' })
  site?: Site;
  @ForeignKey(() => User, { name: 'lift_packages_created_by_id_fkey' })
  @Column({ type: 'uuid', name: 'created_by_id' })
  createdById: string;
  @Column({ type: 'varchar', length: 30 }) status: PackageStatus;
  @Column({ type: 'date', name: 'planned_lift_date', nullable: true }) plannedLiftDate: string | null;
  /** When the review of the latest submission is due (shared/rules/review-due.ts). */
  @Column({ type: 'date', name: 'review_due_on', nullable: true }) reviewDueOn: string | null;
  @Column({ type: 'int', name: 'current_revision', default: 1 }) currentRevision: number;
  @Column({ type: 'uuid', name: 'assigned_engineer_id', nullable: true }) assignedEngineerId: string | null;
  @ManyToOne(() => User, { nullable: true })
  @JoinColumn({
    name: 'assigned_engineer_id',
    foreignKeyConstraintName: 'lift_packages_assigned_engineer_id_fkey',
  })
  assignedEngineer?: User | null;
  @Column({ type: 'boolean', default: false }) critical: boolean;
  @Column({ type: 'varchar', length: 20, name: 'worst_status', nullable: true })
  worstStatus: CheckStatus | null;
  @Column({ type: 'int', name: 'open_discrepancies', default: 0 }) openDiscrepancies: number;
  @Column({ type: 'varchar', length: 30, nullable: true }) decision: Decision | null;
  /** The contractor's unit system when the package was created; a site's own setting overrides it. */
  @Column({ type: 'varchar', length: 10, name: 'unit_system', default: 'metric' }) unitSystem: UnitSystem;
  @VersionColumn({ type: 'int', default: 1 }) version: number;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' }) updatedAt: Date;
}

export type RevisionState = 'draft' | 'submitted';

/** The site policy a check run used, with the site and the policy's version at the time. */
export type PolicyUsed = SitePolicy & { siteId: string; policyVersion: number };

@Index('revisions_submitted_by_idx', ['submittedById'])
@Entity({ name: 'revisions' })
@Check('revisions_state_check', `state IN ('draft', 'submitted')`)
@Index('revisions_package_idx', ['packageId', 'number'])
@Unique('revisions_package_id_number_key', ['packageId', 'number'])
export class Revision {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'package_id' }) packageId: string;
  @ManyToOne(() => LiftPackage, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'package_id', foreignKeyConstraintName: 'revisions_package_id_fkey' })
  liftPackage?: LiftPackage;
  @Column({ type: 'int' }) number: number;
  @Column({ type: 'varchar', length: 20, default: 'draft' }) state: RevisionState;
  @Column({ type: 'jsonb', default: {} }) inputs: Record<string, unknown>;
  @Column({ type: 'timestamptz', name: 'submitted_at', nullable: true }) submittedAt: Date | null;
  @ForeignKey(() => User, { name: 'revisions_submitted_by_id_fkey' })
  @Column({ type: 'uuid', name: 'submitted_by_id', nullable: true })
  submittedById: string | null;
  @Column({ type: 'varchar', length: 20, name: 'check_status', default: 'none' }) checkStatus: string;
  @Column({ type: 'int', name: 'check_progress', default: 0 }) checkProgress: number;
  @Column({ type: 'varchar', length: 500, name: 'check_error', nullable: true }) checkError: string | null;
  @Column({ type: 'int', name: 'result_version', nullable: true }) resultVersion: number | null;
  /** Written by the check run; read through readStoredResult() (shared/engineering/stored-result.ts). */
  @Column({ type: 'jsonb', nullable: true }) results: LiftResult | null;
  @Column({ type: 'jsonb', name: 'policy_used', nullable: true }) policyUsed: PolicyUsed | null;
  @Column({ type: 'timestamptz', name: 'checked_at', nullable: true }) checkedAt: Date | null;
  /** Stated figures the engineer accepted despite a discrepancy, with the reason. */
  @Column({ type: 'jsonb', name: 'accepted_figures', default: [] })
  acceptedFigures: Array<{
    figure: string;
    reason: string;
    engineerId: string;
    engineer: string;
    at: string;
  }>;
  /** The engineer's placement of the stamp block on page 1 (display frame, points); null: the desk's corner. */
  @Column({ type: 'jsonb', name: 'stamp_placement', nullable: true })
  stampPlacement: { x: number; y: number } | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' }) updatedAt: Date;
}
