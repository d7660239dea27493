// A site belongs to an owner organisation and holds its review policy (overrides of the
// engine's defaults). Reviewers are attached to sites through site_members.
import type { UnitSystem } from '@shared/schemas/common';
import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryColumn,
  PrimaryGeneratedColumn,
  Unique,
} from 'typeorm';
import { Organisation } from '../organisations/organisation.entity';
import { User } from '../users/user.entity';

@Index('sites_owner_organisation_idx', ['ownerOrganisationId'])
@Entity({ name: 'sites' })
@Unique('sites_code_key', ['code'])
@Check('sites_unit_system_check', `unit_system IN ('metric', 'imperial')`)
@Check('sites_review_turnaround_days_check', `review_turnaround_days BETWEEN 1 AND 60`)
@Check('sites_review_margin_days_check', `review_margin_days BETWEEN 0 AND 30`)
export class Site {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'owner_organisation_id' }) ownerOrganisationId: string;
  @ManyToOne(() => Organisation)
  @JoinColumn({ name: 'owner_organisation_id', foreignKeyConstraintName: 'sites_owner_organisation_id_fkey' })
  owner?: Organisation;
  @Column({ type: 'varchar', length: 200 }) name: string;
  @Column({ type: 'varchar', length: 20 }) code: string;
  @Column({ type: 'varchar', length: 300, default: '' }) address: string;
  @Column({ type: 'varchar', length: 60, name: 'time_zone', default: 'UTC' }) timeZone: string;
  @Column({ type: 'jsonb', name: 'review_policy', default: {} }) reviewPolicy: Record<string, unknown>;
  @Column({ type: 'int', name: 'policy_version', default: 1 }) policyVersion: number;
  /** Working days a review is given, and calendar days before the lift it must be done by (migration ReviewDue1764724300000). */
  @Column({ type: 'int', name: 'review_turnaround_days', default: 5 }) reviewTurnaroundDays: number;
  @Column({ type: 'int', name: 'review_margin_days', default: 2 }) reviewMarginDays: number;
  /** The unit system of every document of the site's packages; null: each package's own. */
  @Column({ type: 'varchar', length: 10, name: 'unit_system', nullable: true }) unitSystem: UnitSystem | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
}

@Index('site_members_user_idx', ['userId'])
@Entity({ name: 'site_members' })
export class SiteMember {
  @PrimaryColumn({ type: 'uuid', name: 'site_id' }) siteId: string;
  @PrimaryColumn({ type: 'uuid', name: 'user_id' }) userId: string;
  @ManyToOne(() => Site, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'site_members_site_id_fkey' })
  site?: Site;
  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'site_members_user_id_fkey' })
  user?: User;
}
