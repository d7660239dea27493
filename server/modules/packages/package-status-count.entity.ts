// How many packages each site holds per contractor, status and "first draft" (never submitted:
// only its contractor sees it). Written only by the trigger of 1764721000000-queue-at-scale on
// lift_packages; read for the counts above the queue (status-counts.ts).
import { Column, Entity, Index, PrimaryColumn } from 'typeorm';

@Entity({ name: 'package_status_counts' })
@Index('package_status_counts_contractor_idx', ['contractorOrganisationId'])
export class PackageStatusCount {
  @PrimaryColumn({ type: 'uuid', name: 'site_id', primaryKeyConstraintName: 'package_status_counts_pkey' })
  siteId: string;
  @PrimaryColumn({
    type: 'uuid',
    name: 'contractor_organisation_id',
    primaryKeyConstraintName: 'package_status_counts_pkey',
  })
  contractorOrganisationId: string;
  @PrimaryColumn({
    type: 'varchar',
    length: 30,
    primaryKeyConstraintName: 'package_status_counts_pkey',
  })
  status: string;
  @PrimaryColumn({
    type: 'boolean',
    name: 'first_draft',
    primaryKeyConstraintName: 'package_status_counts_pkey',
  })
  firstDraft: boolean;
  @Column({ type: 'int', default: 0 }) n: number;
}
