// The OpenAPI description of the reviews routes (routes.ts beside it), from the zod schemas they validate with.
import { PackageDetail } from '@shared/schemas/packages';
import {
  AcceptFigureBody,
  AssignBody,
  AssignResult,
  AssignmentHistory,
  DecisionBody,
  EngineerList,
  FindingBody,
  FindingList,
  FindingUpdateBody,
  Markup,
  MarkupBody,
  RevisionCompare,
} from '@shared/schemas/reviews';
import { StampPlacementBody, StampPlacementView } from '@shared/schemas/stamp-placement';
import { z } from 'zod';
import { PackageIdParams } from '../packages/routes';
import { CompareQuery, FindingParams, MarkupParams, MarkupQuery } from './routes';
import { describeRoute } from '../../lib/openapi';

/** The 409s of the engineer's changes to a revision (review-scope.ts, underReview). */
const ENGINEER_EDIT_CONFLICT =
  "The package is no longer with the engineer (review_closed), it was reassigned meanwhile (reassigned), or the revision's stamped return is requested (return_issued)";

describeRoute({
  method: 'get',
  path: '/engineers',
  summary: 'Engineers of your organisation with their open packages (reviewer, admin)',
  tags: ['review'],
  response: EngineerList,
});
describeRoute({
  method: 'post',
  path: '/assignments',
  summary: 'Assign or reassign an engineer to one or many packages (reviewer)',
  tags: ['review'],
  body: AssignBody,
  response: AssignResult,
  conflict: "The package's status allows no assignment, e.g. once decided (not_assignable)",
});
describeRoute({
  method: 'get',
  path: '/packages/:id/assignments',
  summary: "The package's engineers of record over time, newest first, with the coordinators' notes",
  tags: ['review'],
  params: PackageIdParams,
  response: AssignmentHistory,
});
describeRoute({
  method: 'get',
  path: '/packages/:id/markups',
  summary: 'Markups of a revision, in PDF page coordinates',
  tags: ['review'],
  params: PackageIdParams,
  query: MarkupQuery,
  response: z.object({ items: z.array(Markup) }),
});
describeRoute({
  method: 'post',
  path: '/packages/:id/markups',
  summary: 'Add a markup (assigned engineer)',
  tags: ['review'],
  params: PackageIdParams,
  body: MarkupBody,
  response: Markup,
  status: 201,
  conflict: ENGINEER_EDIT_CONFLICT,
});
describeRoute({
  method: 'delete',
  path: '/packages/:id/markups/:markupId',
  summary: 'Remove a markup (assigned engineer)',
  tags: ['review'],
  params: MarkupParams,
  status: 204,
  conflict: ENGINEER_EDIT_CONFLICT,
});
describeRoute({
  method: 'get',
  path: '/packages/:id/stamp-placement',
  summary:
    "Where the stamp block lands on page 1 of the current revision's plan: the engineer's placement, else the emptiest corner, else a cover sheet (engineer, reviewer)",
  tags: ['review'],
  params: PackageIdParams,
  response: StampPlacementView,
});
describeRoute({
  method: 'put',
  path: '/packages/:id/stamp-placement',
  summary:
    'Place the stamp block on page 1 (assigned engineer): the lower-left corner of its outline, in points from the page’s lower-left corner as displayed',
  tags: ['review'],
  params: PackageIdParams,
  body: StampPlacementBody,
  response: StampPlacementView,
  conflict: ENGINEER_EDIT_CONFLICT,
  answers: {
    400: 'x or y puts the block off page 1: the field and its limits are named',
    422: 'The block would cover part of page 1 — the plan’s content, a markup or the footer (stamp_over_content)',
  },
});
describeRoute({
  method: 'delete',
  path: '/packages/:id/stamp-placement',
  summary:
    'Let the desk place the stamp block again (assigned engineer): the emptiest corner, else a cover sheet',
  tags: ['review'],
  params: PackageIdParams,
  response: StampPlacementView,
  conflict: ENGINEER_EDIT_CONFLICT,
});
describeRoute({
  method: 'get',
  path: '/packages/:id/findings',
  summary: 'Findings of every revision with their state',
  tags: ['review'],
  params: PackageIdParams,
  response: FindingList,
});
describeRoute({
  method: 'post',
  path: '/packages/:id/findings',
  summary: 'Raise a finding on a page, a markup or a check (assigned engineer)',
  tags: ['review'],
  params: PackageIdParams,
  body: FindingBody,
  response: FindingList,
  status: 201,
  conflict: ENGINEER_EDIT_CONFLICT,
});
describeRoute({
  method: 'patch',
  path: '/packages/:id/findings/:findingId',
  summary: 'Answer (contractor) or close/reopen (engineer) a finding',
  tags: ['review'],
  params: FindingParams,
  body: FindingUpdateBody,
  response: FindingList,
  conflict:
    "Not in this package status (wrong_state), the finding is closed (finding_closed), the package was reassigned meanwhile (reassigned), or the revision's stamped return is requested (return_issued)",
});
describeRoute({
  method: 'post',
  path: '/packages/:id/accepted-figures',
  summary: 'Accept a stated figure that differs, with a reason (assigned engineer)',
  tags: ['review'],
  params: PackageIdParams,
  body: AcceptFigureBody,
  response: PackageDetail,
  conflict: ENGINEER_EDIT_CONFLICT,
});
describeRoute({
  method: 'post',
  path: '/packages/:id/decision',
  summary:
    'Record the decision (assigned engineer), confirmed with the engineer’s password; Accepted and Accepted as noted need an override reason while a check fails, a Major finding is not closed or a disagreeing stated figure is not accepted',
  tags: ['review'],
  params: PackageIdParams,
  body: DecisionBody,
  response: PackageDetail,
  conflict:
    "The package changed since baseVersion (stale_review), its status allows no decision (review_closed), it was reassigned meanwhile (reassigned), or the revision's stamped return is requested (return_issued)",
  answers: {
    401: 'Not signed in, or the password did not confirm the decision (step_up_failed, one message for every cause)',
    422: 'Accepted or Accepted as noted while items stand against it, without an override reason (override_required): the message lists the items, the field is overrideReason',
    429: 'Too many wrong passwords for this person in the window (too_many_attempts)',
  },
});
describeRoute({
  method: 'post',
  path: '/packages/:id/revisions',
  summary: 'Start the next revision after Revise and resubmit or Rejected (contractor)',
  tags: ['review'],
  params: PackageIdParams,
  response: PackageDetail,
  status: 201,
  conflict: 'Only after a return as Revise and resubmit or Rejected (not_returned_for_revision)',
});
describeRoute({
  method: 'get',
  path: '/packages/:id/compare',
  summary: 'Inputs and check results that differ between two revisions',
  tags: ['review'],
  params: PackageIdParams,
  query: CompareQuery,
  response: RevisionCompare,
});
