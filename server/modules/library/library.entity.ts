// The fleet library's tables (see the FleetLibrary migration): cranes, configurations, their
// immutable versions with the chart's cells, owner-desk verifications and packages' uses.
// Constraint and index names are the ones PostgreSQL gave the migration's tables, so the schema
// builder finds nothing to change (tests/api/schema-drift.test.ts).
import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  ForeignKey,
  Index,
  PrimaryColumn,
  PrimaryGeneratedColumn,
  Unique,
  UpdateDateColumn,
} from 'typeorm';
import type { ChartNotes, ConfigurationDetails, CraneFixedData } from '@shared/schemas/library';
import type { ChartUnits } from '@shared/library/chart-grid';
import type { CRANE_TYPES } from '@shared/schemas/lift-input';
import { Organisation } from '../organisations/organisation.entity';
import { LiftPackage, Revision } from '../packages/package.entity';
import { User } from '../users/user.entity';

@Index('library_cranes_created_by_idx', ['createdById'])
@Entity({ name: 'library_cranes' })
@Check('library_cranes_type_check', `type IN ('mobile_outriggers', 'mobile_crawler', 'gantry_a_frame')`)
@Unique('library_cranes_organisation_id_fleet_number_key', ['organisationId', 'fleetNumber'])
export class LibraryCrane {
  @PrimaryGeneratedColumn('uuid') id: string;
  @ForeignKey(() => Organisation, { name: 'library_cranes_organisation_id_fkey' })
  @Column({ type: 'uuid', name: 'organisation_id' })
  organisationId: string;
  @Column({ type: 'varchar', length: 40, name: 'fleet_number' }) fleetNumber: string;
  @Column({ type: 'varchar', length: 100 }) make: string;
  @Column({ type: 'varchar', length: 100 }) model: string;
  @Column({ type: 'varchar', length: 30 }) type: (typeof CRANE_TYPES)[number];
  // PostgreSQL reports the default as '{}'::jsonb; TypeORM compares it without the cast.
  @Column({ type: 'jsonb', default: () => "'{}'" }) fixed: CraneFixedData;
  @ForeignKey(() => User, { name: 'library_cranes_created_by_id_fkey' })
  @Column({ type: 'uuid', name: 'created_by_id' })
  createdById: string;
  @Column({ type: 'timestamptz', name: 'retired_at', nullable: true }) retiredAt: Date | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' }) updatedAt: Date;
}

@Entity({ name: 'library_configurations' })
@Index('library_configurations_crane_idx', ['craneId'])
export class LibraryConfiguration {
  @PrimaryGeneratedColumn('uuid') id: string;
  @ForeignKey(() => LibraryCrane, { name: 'library_configurations_crane_id_fkey', onDelete: 'CASCADE' })
  @Column({ type: 'uuid', name: 'crane_id' })
  craneId: string;
  @Column({ type: 'varchar', length: 200 }) name: string;
  @Column({ type: 'int', name: 'current_version', default: 1 }) currentVersion: number;
  @Column({ type: 'timestamptz', name: 'retired_at', nullable: true }) retiredAt: Date | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
}

export interface CraneSnapshot {
  fleetNumber: string;
  make: string;
  model: string;
  type: (typeof CRANE_TYPES)[number];
  fixed: CraneFixedData;
}

export interface DocumentFile {
  storageKey: string;
  name: string;
  sha256: string;
  sizeBytes: number;
  pages: number;
}

@Index('library_versions_created_by_idx', ['createdById'])
@Index('library_versions_retired_by_idx', ['retiredById'])
@Entity({ name: 'library_versions' })
@Check('library_versions_number_check', `number >= 1`)
@Unique('library_versions_configuration_id_number_key', ['configurationId', 'number'])
export class LibraryVersion {
  @PrimaryGeneratedColumn('uuid') id: string;
  @ForeignKey(() => LibraryConfiguration, {
    name: 'library_versions_configuration_id_fkey',
    onDelete: 'CASCADE',
  })
  @Column({ type: 'uuid', name: 'configuration_id' })
  configurationId: string;
  @Column({ type: 'int' }) number: number;
  @Column({ type: 'jsonb', name: 'crane_snapshot' }) craneSnapshot: CraneSnapshot;
  @Column({ type: 'jsonb' }) details: ConfigurationDetails;
  @Column({ type: 'jsonb' }) notes: ChartNotes;
  @Column({ type: 'jsonb' }) document: { title: string; edition?: string; page?: string };
  @Column({ type: 'jsonb', name: 'chart_units' }) chartUnits: ChartUnits;
  @Column({ type: 'jsonb', name: 'document_file', nullable: true }) documentFile: DocumentFile | null;
  @Column({ type: 'varchar', length: 500, name: 'change_note', nullable: true }) changeNote: string | null;
  @ForeignKey(() => User, { name: 'library_versions_created_by_id_fkey' })
  @Column({ type: 'uuid', name: 'created_by_id' })
  createdById: string;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  @Column({ type: 'timestamptz', name: 'retired_at', nullable: true }) retiredAt: Date | null;
  @ForeignKey(() => User, { name: 'library_versions_retired_by_id_fkey' })
  @Column({ type: 'uuid', name: 'retired_by_id', nullable: true })
  retiredById: string | null;
}

@Entity({ name: 'library_chart_cells' })
@Check('library_chart_cells_boom_length_check', `boom_length > 0`)
@Check('library_chart_cells_radius_check', `radius >= 0`)
@Check('library_chart_cells_capacity_check', `capacity > 0`)
export class LibraryChartCell {
  @ForeignKey(() => LibraryVersion, { name: 'library_chart_cells_version_id_fkey', onDelete: 'CASCADE' })
  @PrimaryColumn({ type: 'uuid', name: 'version_id' })
  versionId: string;
  @PrimaryColumn({ type: 'double precision', name: 'boom_length' }) boomLength: number;
  @PrimaryColumn({ type: 'double precision' }) radius: number;
  @Column({ type: 'double precision' }) capacity: number;
}

@Index('library_verifications_engineer_idx', ['engineerId'])
@Index('library_verifications_owner_organisation_idx', ['ownerOrganisationId'])
@Index('library_verifications_package_idx', ['packageId'])
@Entity({ name: 'library_verifications' })
@Unique('library_verifications_version_id_owner_organisation_id_key', ['versionId', 'ownerOrganisationId'])
export class LibraryVerification {
  @PrimaryGeneratedColumn('uuid') id: string;
  @ForeignKey(() => LibraryVersion, { name: 'library_verifications_version_id_fkey', onDelete: 'CASCADE' })
  @Column({ type: 'uuid', name: 'version_id' })
  versionId: string;
  @ForeignKey(() => Organisation, { name: 'library_verifications_owner_organisation_id_fkey' })
  @Column({ type: 'uuid', name: 'owner_organisation_id' })
  ownerOrganisationId: string;
  @ForeignKey(() => User, { name: 'library_verifications_engineer_id_fkey' })
  @Column({ type: 'uuid', name: 'engineer_id' })
  engineerId: string;
  @ForeignKey(() => LiftPackage, { name: 'library_verifications_package_id_fkey', onDelete: 'SET NULL' })
  @Column({ type: 'uuid', name: 'package_id', nullable: true })
  packageId: string | null;
  @Column({ type: 'varchar', length: 1000 }) note: string;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
}

@Index('library_uses_package_idx', ['packageId'])
@Entity({ name: 'library_uses' })
@Check('library_uses_slot_check', `slot BETWEEN 0 AND 3`)
@Index('library_uses_version_idx', ['versionId'])
@Unique('library_uses_revision_id_slot_key', ['revisionId', 'slot'])
export class LibraryUseRow {
  @PrimaryGeneratedColumn('uuid') id: string;
  @ForeignKey(() => Revision, { name: 'library_uses_revision_id_fkey', onDelete: 'CASCADE' })
  @Column({ type: 'uuid', name: 'revision_id' })
  revisionId: string;
  @ForeignKey(() => LiftPackage, { name: 'library_uses_package_id_fkey', onDelete: 'CASCADE' })
  @Column({ type: 'uuid', name: 'package_id' })
  packageId: string;
  @Column({ type: 'int' }) slot: number;
  // RESTRICT: a version a package uses cannot be deleted.
  @ForeignKey(() => LibraryVersion, { name: 'library_uses_version_id_fkey', onDelete: 'RESTRICT' })
  @Column({ type: 'uuid', name: 'version_id' })
  versionId: string;
  @Column({ type: 'boolean', default: false }) detached: boolean;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
}

export const LIBRARY_ENTITIES = [
  LibraryCrane,
  LibraryConfiguration,
  LibraryVersion,
  LibraryChartCell,
  LibraryVerification,
  LibraryUseRow,
];
