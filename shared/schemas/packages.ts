// Lift package payloads: the list the queue and the contractor's desk show, and one package.
import { z } from 'zod';
import { safeText } from './safe-text';
import { Decision, PackageStatus, PACKAGE_STATUSES, UnitSystem } from './common';

export const CheckStatus = z.enum(['pass', 'caution', 'fail', 'not_applicable']);
export type CheckStatus = z.infer<typeof CheckStatus>;

export const PACKAGE_SORTS = [
  'plannedLiftDate',
  '-plannedLiftDate',
  'updatedAt',
  '-updatedAt',
  'reference',
  '-reference',
  'openDiscrepancies',
  '-openDiscrepancies',
  'revision',
  '-revision',
  'reviewDue',
  '-reviewDue',
] as const;

const flag = (name: string) =>
  z.enum(['true', 'false'], { message: `${name} must be true or false` }).transform((v) => v === 'true');

export const PackageListQuery = z.object({
  status: z.enum(PACKAGE_STATUSES).optional(),
  siteId: z.uuid({ message: 'siteId must be a UUID' }).optional(),
  contractorId: z.uuid({ message: 'contractorId must be a UUID' }).optional(),
  /** An engineer's id, or "none" for packages nobody is assigned to. */
  engineerId: z
    .union([z.uuid(), z.literal('none')], { message: 'engineerId must be a UUID or none' })
    .optional(),
  critical: flag('critical').optional(),
  /** true: only packages with open discrepancies. */
  discrepancies: flag('discrepancies').optional(),
  /** Packages whose planned lift date is within this many days from today (late ones included). */
  liftWithinDays: z.coerce
    .number()
    .int()
    .min(0, 'liftWithinDays must be 0 or more')
    .max(365, 'liftWithinDays must be at most 365')
    .optional(),
  revisionMin: z.coerce.number().int().min(1, 'revisionMin must be 1 or more').max(1000).optional(),
  q: safeText('q').trim().max(100, 'q must be at most 100 characters').optional(),
  sort: z
    .enum(PACKAGE_SORTS, { message: `sort must be one of ${PACKAGE_SORTS.join(', ')}` })
    .default('plannedLiftDate'),
  /**
   * Where the page starts: the `nextCursor` or `previousCursor` of the page before, for the same
   * filters and sort. Without it, `page` counts from the start (an offset: slower on deep pages).
   */
  cursor: z
    .string()
    .max(600, 'cursor must be at most 600 characters')
    .regex(/^[A-Za-z0-9_-]+$/, 'cursor must be one the list gave out')
    .optional(),
  /** The page's number, shown beside the rows; it positions the rows only when there is no cursor. */
  page: z.coerce.number().int().min(1, 'page must be 1 or more').max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100, 'pageSize must be at most 100').default(25),
});
export type PackageListQuery = z.infer<typeof PackageListQuery>;

export const PackageSummary = z.object({
  id: z.uuid(),
  reference: z.string(),
  title: z.string(),
  status: PackageStatus,
  site: z.object({ id: z.uuid(), name: z.string() }),
  contractor: z.object({ id: z.uuid(), name: z.string() }),
  plannedLiftDate: z.string().nullable(),
  /** When the review of the latest submission is due (YYYY-MM-DD), and whether that has passed while it is owed. */
  reviewDueOn: z.string().nullable().default(null),
  reviewOverdue: z.boolean().default(false),
  revisionNumber: z.number().int(),
  engineer: z.object({ id: z.uuid(), name: z.string() }).nullable(),
  critical: z.boolean(),
  worstStatus: CheckStatus.nullable(),
  openDiscrepancies: z.number().int(),
  decision: Decision.nullable(),
  updatedAt: z.string(),
});
export type PackageSummary = z.infer<typeof PackageSummary>;

export const PackageListResponse = z.object({
  items: z.array(PackageSummary),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
  countsByStatus: z.record(z.string(), z.number().int()),
  /**
   * With filters the kept counts cannot answer, at most this many packages are counted: when more
   * match, every status is in `countsOverLimit` and its count is a lower bound ("at least").
   */
  countLimit: z.number().int().default(0),
  countsOverLimit: z.array(PackageStatus).default([]),
  /** `total` is a lower bound (more packages match than were counted). */
  totalOverLimit: z.boolean().default(false),
  /** The cursor of the page after this one (null on the last page) and of the page before (null on the first). */
  nextCursor: z.string().nullable().default(null),
  previousCursor: z.string().nullable().default(null),
});
export type PackageListResponse = z.infer<typeof PackageListResponse>;

/** A new lift package (contractors). It starts as a draft with an empty revision 1. */
export const CreatePackageBody = z.object({
  title: safeText('title')
    .trim()
    .min(3, 'title must be at least 3 characters')
    .max(200, 'title must be at most 200 characters'),
  siteId: z.uuid({ message: 'siteId must be the id of a site' }),
  plannedLiftDate: z.iso
    .date({ message: 'plannedLiftDate must be a date (YYYY-MM-DD)' })
    .nullable()
    .optional(),
});
export type CreatePackageBody = z.infer<typeof CreatePackageBody>;

/**
 * Autosave of a draft. `inputs` is the lift as typed so far: it may be incomplete (the
 * full LiftInput schema is enforced on submit), but it must be a JSON object under the
 * size limit. `baseUpdatedAt` guards against a stale tab overwriting newer work (409).
 */
export const SaveDraftBody = z.object({
  title: safeText('title')
    .trim()
    .min(3, 'title must be at least 3 characters')
    .max(200, 'title must be at most 200 characters')
    .optional(),
  siteId: z.uuid({ message: 'siteId must be the id of a site' }).optional(),
  plannedLiftDate: z.iso
    .date({ message: 'plannedLiftDate must be a date (YYYY-MM-DD)' })
    .nullable()
    .optional(),
  inputs: z.record(z.string(), z.unknown()).optional(),
  // A malformed value must not silently skip the stale-save guard.
  baseUpdatedAt: z.iso
    .datetime({
      offset: true,
      message: "baseUpdatedAt must be a date-time (ISO 8601), the draft's updatedAt",
    })
    .optional(),
});
export type SaveDraftBody = z.infer<typeof SaveDraftBody>;

export const FILE_KINDS = ['lift_plan', 'supporting'] as const;
export const FileKind = z.enum(FILE_KINDS);
export type FileKind = z.infer<typeof FileKind>;

export const UploadFileFields = z.object({
  kind: z.enum(FILE_KINDS, { message: "kind must be 'lift_plan' or 'supporting'" }).default('supporting'),
});

/** Annotations as a contractor would name them (server/modules/files/pdf-contents.ts maps the PDF subtypes). */
const ANNOTATION_KINDS = [
  'comment',
  'stamp',
  'shape',
  'attachment',
  'widget',
  'link',
  'media',
  'other',
] as const;
export const AnnotationKind = z.enum(ANNOTATION_KINDS);
export type AnnotationKind = z.infer<typeof AnnotationKind>;

/**
 * What an uploaded PDF carries besides its pages' content, found when it was checked. None
 * of it is carried into the stamped return.
 */
export const PdfContents = z.object({
  annotations: z.array(
    z.object({ kind: AnnotationKind, page: z.number().int().min(1), count: z.number().int().min(1) }),
  ),
  /** JavaScript actions and scripts anywhere in the file. */
  javascript: z.number().int().min(0),
  /** Other actions run when the file opens or a page is shown (/OpenAction, /AA). */
  actions: z.number().int().min(0),
  embeddedFiles: z.number().int().min(0),
  formFields: z.number().int().min(0),
  xfa: z.boolean(),
});
export type PdfContents = z.infer<typeof PdfContents>;

export const FileSummary = z.object({
  id: z.uuid(),
  kind: FileKind,
  originalName: z.string(),
  sha256: z.string(),
  sizeBytes: z.number().int(),
  pages: z.number().int(),
  /** The revision this document was carried over from unchanged, or null when uploaded to this one. */
  carriedFromRevision: z.number().int().nullable(),
  createdAt: z.string(),
  /** Null for a file stored before uploads were inspected for it. */
  contents: PdfContents.nullable(),
  /** The same in words (shared/vocabulary/pdf-contents.ts); null when nothing was found or not known. */
  notCarried: z.string().nullable(),
});
export type FileSummary = z.infer<typeof FileSummary>;

export const CHECK_RUN_STATES = ['none', 'queued', 'running', 'done', 'invalid', 'failed'] as const;

export const RevisionDetail = z.object({
  id: z.uuid(),
  number: z.number().int(),
  state: z.enum(['draft', 'submitted']),
  inputs: z.record(z.string(), z.unknown()),
  submittedAt: z.string().nullable(),
  updatedAt: z.string(),
  check: z.object({
    status: z.enum(CHECK_RUN_STATES),
    progress: z.number().int(),
    error: z.string().nullable(),
    resultVersion: z.number().int().nullable(),
    checkedAt: z.string().nullable(),
  }),
  /** The engine's LiftResult (see shared/engineering/types.ts) once the check has run. */
  results: z.record(z.string(), z.unknown()).nullable(),
  files: z.array(FileSummary),
  /** Stated figures the engineer accepted despite a discrepancy, with the reason. */
  acceptedFigures: z.array(
    z.object({ figure: z.string(), reason: z.string(), engineer: z.string(), at: z.string() }),
  ),
  /**
   * When the stamped return of this revision was first requested; from then on its decision,
   * findings and markups are fixed (shared/rules/package-status.ts, fixedByReturn). Null before.
   */
  returnRequestedAt: z.string().nullable(),
});
export type RevisionDetail = z.infer<typeof RevisionDetail>;

export const PackageDetail = z.object({
  package: PackageSummary.extend({ version: z.number().int() }),
  revisions: z.array(
    z.object({
      id: z.uuid(),
      number: z.number().int(),
      state: z.enum(['draft', 'submitted']),
      submittedAt: z.string().nullable(),
      checkStatus: z.enum(CHECK_RUN_STATES),
    }),
  ),
  current: RevisionDetail,
  /** The latest decision on the package (any revision), with its conditions. */
  decision: z
    .object({
      decision: Decision,
      conditions: z.string(),
      engineer: z.string(),
      revisionNumber: z.number().int(),
      at: z.string(),
      /** Why an acceptance stands despite the items listed in `overridden`; null when none stood. */
      overrideReason: z.string().nullable().default(null),
      overridden: z.array(z.string()).default([]),
      /** sha-256 of the inputs and results it was made on, and the engine's version (null before these were kept). */
      madeOn: z
        .object({
          inputsSha256: z.string().nullable(),
          resultsSha256: z.string().nullable(),
          engineVersion: z.string().nullable(),
        })
        .default({ inputsSha256: null, resultsSha256: null, engineVersion: null }),
    })
    .nullable(),
  /**
   * The unit system of the package's documents (the stamped return and its calculation sheet): the
   * site's when its admin set one, else the package's own (its contractor's when it was created).
   */
  documentUnits: z
    .object({ system: UnitSystem, source: z.enum(['package', 'site']) })
    .default({ system: 'metric', source: 'package' }),
  /** The site's review policy as the check run applies it (defaults with the site's overrides). */
  sitePolicy: z.record(z.string(), z.unknown()),
  events: z.array(
    z.object({
      id: z.uuid(),
      action: z.string(),
      actor: z.string().nullable(),
      at: z.string(),
      detail: z.record(z.string(), z.unknown()),
    }),
  ),
});
export type PackageDetail = z.infer<typeof PackageDetail>;

export const SiteList = z.object({
  items: z.array(z.object({ id: z.uuid(), name: z.string(), code: z.string(), owner: z.string() })),
});
export type SiteList = z.infer<typeof SiteList>;
