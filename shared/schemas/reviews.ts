// The review's payloads: assignments, markups (in PDF page coordinates), findings,
// decisions, stamped returns and the public verification answer.
import { z } from 'zod';
import { safeText } from './safe-text';
import { Decision } from './common';

/** Markup colours: our own palette, named for what they look like. */
export const MARKUP_COLOURS = {
  rust: '#b3401a',
  cobalt: '#1f4fbf',
  verdigris: '#0f6b5f',
  graphite: '#222a30',
} as const;
export const MarkupColour = z.enum(['rust', 'cobalt', 'verdigris', 'graphite'], {
  message: 'colour must be one of rust, cobalt, verdigris, graphite',
});
export type MarkupColour = z.infer<typeof MarkupColour>;

export const MARKUP_KINDS = ['rectangle', 'ellipse', 'cloud', 'arrow', 'text', 'pin'] as const;

const coord = (name: string) =>
  z
    .number({ message: `${name} must be a number (PDF points)` })
    .finite()
    .min(-10_000, `${name} must be between -10000 and 10000 points`)
    .max(10_000, `${name} must be between -10000 and 10000 points`);
const size = (name: string) =>
  z
    .number({ message: `${name} must be a number (PDF points)` })
    .finite()
    .min(1, `${name} must be at least 1 point`)
    .max(20_000, `${name} must be at most 20000 points`);

/**
 * Geometry in PDF user space of the page: points (1/72 in), origin at the bottom-left of
 * the page's view box, y upwards — the same at any zoom and in the stamped file.
 */
export const BoxGeometry = z.object({
  x: coord('x'),
  y: coord('y'),
  width: size('width'),
  height: size('height'),
});
export const ArrowGeometry = z.object({ x1: coord('x1'), y1: coord('y1'), x2: coord('x2'), y2: coord('y2') });
export const PointGeometry = z.object({ x: coord('x'), y: coord('y') });

const markupBase = {
  fileId: z.uuid({ message: 'fileId must be the id of one of the revision’s files' }),
  pageNumber: z.number().int().min(1, 'pageNumber must be 1 or more').max(10_000),
  colour: MarkupColour.default('rust'),
};

export const MarkupBody = z.discriminatedUnion('kind', [
  z.object({
    ...markupBase,
    kind: z.literal('rectangle'),
    geometry: BoxGeometry,
    text: safeText('text').max(500, 'text must be at most 500 characters').nullish(),
  }),
  z.object({
    ...markupBase,
    kind: z.literal('ellipse'),
    geometry: BoxGeometry,
    text: safeText('text').max(500, 'text must be at most 500 characters').nullish(),
  }),
  z.object({
    ...markupBase,
    kind: z.literal('cloud'),
    geometry: BoxGeometry,
    text: safeText('text').max(500, 'text must be at most 500 characters').nullish(),
  }),
  z.object({
    ...markupBase,
    kind: z.literal('arrow'),
    geometry: ArrowGeometry,
    text: safeText('text').max(500, 'text must be at most 500 characters').nullish(),
  }),
  z.object({
    ...markupBase,
    kind: z.literal('text'),
    geometry: PointGeometry.extend({ fontSize: z.number().min(4).max(72).default(11) }),
    text: safeText('text')
      .trim()
      .min(1, 'text must not be empty')
      .max(500, 'text must be at most 500 characters'),
  }),
  z.object({
    ...markupBase,
    kind: z.literal('pin'),
    geometry: PointGeometry,
    text: safeText('text').max(500, 'text must be at most 500 characters').nullish(),
  }),
]);
export type MarkupBody = z.infer<typeof MarkupBody>;

export const Markup = z.object({
  id: z.uuid(),
  revisionId: z.uuid(),
  fileId: z.uuid(),
  pageNumber: z.number().int(),
  kind: z.enum(MARKUP_KINDS),
  geometry: z.record(z.string(), z.number()),
  colour: MarkupColour,
  text: z.string().nullable(),
  /** Pins are numbered 1, 2, 3… per revision. */
  number: z.number().int().nullable(),
  createdBy: z.string(),
  createdAt: z.string(),
});
export type Markup = z.infer<typeof Markup>;

export const FINDING_SEVERITIES = ['note', 'minor', 'major', 'blocking'] as const;
export const FINDING_STATES = ['open', 'answered', 'closed'] as const;

export const FindingBody = z
  .object({
    text: safeText('text')
      .trim()
      .min(3, 'text must be at least 3 characters')
      .max(4000, 'text must be at most 4000 characters'),
    severity: z.enum(FINDING_SEVERITIES, { message: 'severity must be one of note, minor, major, blocking' }),
    checkId: safeText('checkId').max(40).nullish(),
    markupId: z.uuid().nullish(),
    fileId: z.uuid().nullish(),
    pageNumber: z.number().int().min(1).max(10_000).nullish(),
  })
  .refine((f) => !f.pageNumber || f.fileId, {
    message: 'fileId is required with pageNumber',
    path: ['fileId'],
  });
export type FindingBody = z.infer<typeof FindingBody>;

export const Finding = z.object({
  id: z.uuid(),
  revisionNumber: z.number().int(),
  text: z.string(),
  severity: z.enum(FINDING_SEVERITIES),
  state: z.enum(FINDING_STATES),
  response: z.string().nullable(),
  checkId: z.string().nullable(),
  markupId: z.uuid().nullable(),
  fileId: z.uuid().nullable(),
  pageNumber: z.number().int().nullable(),
  createdBy: z.string(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Finding = z.infer<typeof Finding>;

/** The contractor answers a finding; the engineer closes or reopens it. */
export const FindingUpdateBody = z.object({
  state: z.enum(FINDING_STATES).optional(),
  response: safeText('response').trim().max(4000, 'response must be at most 4000 characters').optional(),
});

/** The engineer's acceptance of a contractor figure that differs from the recomputation. */
export const AcceptFigureBody = z.object({
  figure: safeText('figure').min(1).max(40),
  reason: safeText('reason')
    .trim()
    .min(5, 'reason must be at least 5 characters')
    .max(2000, 'reason must be at most 2000 characters'),
});

export const OVERRIDE_REASON_MIN = 10;
export const OVERRIDE_REASON_MAX = 2000;

export const DecisionBody = z
  .object({
    decision: Decision,
    conditions: safeText('conditions')
      .trim()
      .max(4000, 'conditions must be at most 4000 characters')
      .default(''),
    /** The package version the engineer was looking at: a newer one answers 409. */
    baseVersion: z.number().int().min(1, 'baseVersion must be the package version you read'),
    /**
     * Why Accepted / Accepted as noted stands although a check fails, a Major finding is open or
     * a disagreeing figure is not accepted (shared/rules/decision-gate.ts). Required then; printed
     * on the return and kept in the history.
     */
    overrideReason: safeText('overrideReason')
      .trim()
      .max(OVERRIDE_REASON_MAX, `overrideReason must be at most ${OVERRIDE_REASON_MAX} characters`)
      .default(''),
    /** The engineer's own password again: the decision is confirmed by the person, not the session. */
    password: z
      .string({ message: 'password is required: enter your password to confirm the decision' })
      .min(1, 'password is required: enter your password to confirm the decision')
      .max(200, 'password must be at most 200 characters'),
  })
  .refine((d) => d.decision !== 'accepted_as_noted' || d.conditions.length > 0, {
    message: 'conditions are required with Accepted as noted',
    path: ['conditions'],
  })
  .refine((d) => d.overrideReason.length === 0 || d.overrideReason.length >= OVERRIDE_REASON_MIN, {
    message: `overrideReason must be at least ${OVERRIDE_REASON_MIN} characters`,
    path: ['overrideReason'],
  });
export type DecisionBody = z.infer<typeof DecisionBody>;

export const AssignBody = z.object({
  packageIds: z
    .array(z.uuid())
    .min(1, 'packageIds must list at least 1 package')
    .max(100, 'packageIds must list at most 100 packages'),
  engineerId: z.uuid({ message: 'engineerId must be the id of an engineer' }),
  /** A note to the engineer, in the mail and the assignment history. */
  note: safeText('note').trim().max(500, 'note must be at most 500 characters').optional(),
});

/** GET /api/packages/:id/assignments: who has been the package's engineer of record, newest first. */
export const AssignmentHistory = z.object({
  items: z.array(
    z.object({
      id: z.uuid(),
      engineer: z.string(),
      assignedBy: z.string(),
      assignedAt: z.string(),
      endedAt: z.string().nullable(),
      note: z.string().nullable(),
    }),
  ),
});
export type AssignmentHistory = z.infer<typeof AssignmentHistory>;

export const Verification = z.object({
  found: z.literal(true),
  reference: z.string(),
  title: z.string(),
  revision: z.number().int(),
  decision: Decision,
  decisionLabel: z.string(),
  decidedOn: z.string(),
  issuedOn: z.string(),
  /** The decision's conditions as the stamp prints them ('' for none). */
  conditions: z.string().default(''),
  /** Why an acceptance stands over what stood against it; null when nothing did. */
  overrideReason: z.string().nullable().default(null),
  sha256: z.string(),
  /** SHA-256 of the certificate that signed the return; null for a return made before signing. */
  signingCertificateSha256: z.string().nullable().default(null),
  current: z.boolean(),
  supersededBy: z.number().int().nullable(),
});
export type Verification = z.infer<typeof Verification>;

export const FindingList = z.object({ items: z.array(Finding) });
export type FindingList = z.infer<typeof FindingList>;

/** GET /api/engineers: the engineers of record a coordinator may assign, with their open packages. */
export const Engineer = z.object({
  id: z.uuid(),
  name: z.string(),
  email: z.string(),
  openPackages: z.number().int(),
});
export type Engineer = z.infer<typeof Engineer>;
export const EngineerList = z.object({ items: z.array(Engineer) });
export type EngineerList = z.infer<typeof EngineerList>;

/** POST /api/assignments: how many packages were assigned, and to whom. */
export const AssignResult = z.object({
  assigned: z.number().int(),
  engineer: z.object({ id: z.uuid(), name: z.string(), email: z.string() }),
});
export type AssignResult = z.infer<typeof AssignResult>;

const CompareSide = z.object({ status: z.string(), value: z.number().nullable() }).nullable();

const CompareDocument = z.object({ fileId: z.uuid(), name: z.string(), pages: z.number().int() }).nullable();

export const DOCUMENT_CHANGES = ['unchanged', 'replaced', 'added', 'removed'] as const;

/** GET /api/packages/:id/compare: the inputs that changed between two revisions and every check in each. */
export const RevisionCompare = z.object({
  from: z.number().int(),
  to: z.number().int(),
  /** Each document of either revision: kept as it was, replaced by a new file, added or removed. */
  documents: z.array(
    z.object({
      kind: z.enum(['lift_plan', 'supporting']),
      change: z.enum(DOCUMENT_CHANGES),
      from: CompareDocument,
      to: CompareDocument,
    }),
  ),
  inputs: z.array(z.object({ path: z.string(), from: z.unknown(), to: z.unknown() })),
  checks: z.array(
    z.object({
      id: z.string(),
      label: z.string(),
      unit: z.string(),
      from: CompareSide,
      to: CompareSide,
      changed: z.boolean(),
    }),
  ),
});
export type RevisionCompare = z.infer<typeof RevisionCompare>;
