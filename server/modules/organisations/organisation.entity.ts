// An organisation: a lifting contractor or a site owner (or general contractor).
import { Check, Column, CreateDateColumn, Entity, ForeignKey, Index, PrimaryGeneratedColumn } from 'typeorm';
import type { OrganisationKind } from '@shared/schemas/common';

@Index('organisations_desk_owner_idx', ['deskOwnerId'])
@Entity({ name: 'organisations' })
@Check('organisations_kind_check', `kind IN ('contractor', 'owner')`)
export class Organisation {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'varchar', length: 200 }) name: string;
  @Column({ type: 'varchar', length: 20 }) kind: OrganisationKind;
  /** For a contractor: the owner whose desk it works on (it submits to that owner's sites). */
  @ForeignKey(() => Organisation, { name: 'organisations_desk_owner_id_fkey', onDelete: 'SET NULL' })
  @Column({ type: 'uuid', name: 'desk_owner_id', nullable: true })
  deskOwnerId: string | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
}
