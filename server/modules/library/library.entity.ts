// The fleet library's tables (see the FleetLibrary migration): cranes, configurations, their
// immutable versions with the chart's cells, owner-desk verifications and packages' uses.
import {
  Column,
  CreateDateColumn,
  Entity,
  PrimaryColumn,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';
import type { ChartNotes, ConfigurationDetails, CraneFixedData } from '@shared/schemas/library';
import type { ChartUnits } from '@shared/library/chart-grid';
import type { CRANE_TYPES } from '@shared/schemas/lift-input';

@Entity({ name: 'library_cranes' })
export class LibraryCrane {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'organisation_id' }) organisationId: string;
  @Column({ type: 'varchar', length: 40, name: 'fleet_number' }) fleetNumber: string;
  @Column({ type: 'varchar', length: 100 }) make: string;
  @Column({ type: 'varchar', length: 100 }) model: string;
  @Column({ type: 'varchar', length: 30 }) type: (typeof CRANE_TYPES)[number];
  @Column({ type: 'jsonb', default: () => "'{}'::jsonb" }) fixed: CraneFixedData;
  @Column({ type: 'uuid', name: 'created_by_id' }) createdById: string;
  @Column({ type: 'timestamptz', name: 'retired_at', nullable: true }) retiredAt: Date | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' }) updatedAt: Date;
}

@Entity({ name: 'library_configurations' })
export class LibraryConfiguration {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'crane_id' }) craneId: string;
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

@Entity({ name: 'library_versions' })
export class LibraryVersion {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'configuration_id' }) configurationId: string;
  @Column({ type: 'int' }) number: number;
  @Column({ type: 'jsonb', name: 'crane_snapshot' }) craneSnapshot: CraneSnapshot;
  @Column({ type: 'jsonb' }) details: ConfigurationDetails;
  @Column({ type: 'jsonb' }) notes: ChartNotes;
  @Column({ type: 'jsonb' }) document: { title: string; edition?: string; page?: string };
  @Column({ type: 'jsonb', name: 'chart_units' }) chartUnits: ChartUnits;
  @Column({ type: 'jsonb', name: 'document_file', nullable: true }) documentFile: DocumentFile | null;
  @Column({ type: 'varchar', length: 500, name: 'change_note', nullable: true }) changeNote: string | null;
  @Column({ type: 'uuid', name: 'created_by_id' }) createdById: string;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  @Column({ type: 'timestamptz', name: 'retired_at', nullable: true }) retiredAt: Date | null;
  @Column({ type: 'uuid', name: 'retired_by_id', nullable: true }) retiredById: string | null;
}

@Entity({ name: 'library_chart_cells' })
export class LibraryChartCell {
  @PrimaryColumn({ type: 'uuid', name: 'version_id' }) versionId: string;
  @PrimaryColumn({ type: 'double precision', name: 'boom_length' }) boomLength: number;
  @PrimaryColumn({ type: 'double precision' }) radius: number;
  @Column({ type: 'double precision' }) capacity: number;
}

@Entity({ name: 'library_verifications' })
export class LibraryVerification {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'version_id' }) versionId: string;
  @Column({ type: 'uuid', name: 'owner_organisation_id' }) ownerOrganisationId: string;
  @Column({ type: 'uuid', name: 'engineer_id' }) engineerId: string;
  @Column({ type: 'uuid', name: 'package_id', nullable: true }) packageId: string | null;
  @Column({ type: 'varchar', length: 1000 }) note: string;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
}

@Entity({ name: 'library_uses' })
export class LibraryUseRow {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'revision_id' }) revisionId: string;
  @Column({ type: 'uuid', name: 'package_id' }) packageId: string;
  @Column({ type: 'int' }) slot: number;
  @Column({ type: 'uuid', name: 'version_id' }) versionId: string;
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
