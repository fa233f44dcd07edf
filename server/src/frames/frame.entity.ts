import {
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryColumn,
} from 'typeorm';
import { OrganizationEntity } from '../organizations/organization.entity.js';
import type { FrameExif } from './analysis/exif.js';
import type { FrameAnalysis } from './frame-analysis.js';

/**
 * A test frame: the original and its thumbnail live in object storage under `objectKey` and
 * `thumbnailKey`; a row exists only once both objects are stored.
 */
@Entity('frames')
@Index('ix_frames_org_created', ['organizationId', 'createdAt', 'id'])
export class FrameEntity {
  /** Chosen before the objects are written, so their keys can carry it. */
  @PrimaryColumn({ type: 'uuid' })
  id: string;

  @Column({ type: 'uuid' })
  organizationId: string;

  @ManyToOne(() => OrganizationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organization_id', foreignKeyConstraintName: 'fk_frames_organization' })
  organization?: OrganizationEntity;

  @Column({ type: 'uuid', nullable: true })
  uploadedByUserId: string | null;

  @Column({ type: 'uuid', nullable: true })
  apiKeyId: string | null;

  @Column({ type: 'text', nullable: true })
  fileName: string | null;

  @Column({ type: 'text' })
  contentType: string;

  @Column({ type: 'integer' })
  byteSize: number;

  @Column({ type: 'text' })
  sha256: string;

  @Column({ type: 'integer' })
  width: number;

  @Column({ type: 'integer' })
  height: number;

  @Column({ type: 'text' })
  objectKey: string;

  @Column({ type: 'text' })
  thumbnailKey: string;

  @Column({ type: 'jsonb' })
  exif: FrameExif;

  /**
   * Rows written before warnings had codes hold plain strings in `warnings` and `colour.notes`;
   * `toFrameDto` reads them as `unclassified`.
   */
  @Column({ type: 'jsonb' })
  analysis: FrameAnalysis;

  @Column({ type: 'double precision', nullable: true })
  cctKelvin: number | null;

  @Column({ type: 'double precision', nullable: true })
  miredOffset: number | null;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;
}
