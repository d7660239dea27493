// Point 5 of the security issue, in the shared schemas: a NUL character or a lone UTF-16
// surrogate in a text field is refused by the schema itself, with a message naming the field,
// so a form says which field and every caller of the schema gets the same rule. Upload file
// names follow the same rule on the server.
import { describe, expect, it } from 'vitest';
import type { z } from 'zod';
import { AppError } from '@server/lib/app-error';
import { checkFileName } from '@server/modules/files/pdf-check';
import { InviteBody, OrganisationBody, ProfilePatch, SiteBody } from '@shared/schemas/admin';
import { CreatePackageBody, SaveDraftBody } from '@shared/schemas/packages';
import {
  AcceptFigureBody,
  DecisionBody,
  FindingBody,
  FindingUpdateBody,
  MarkupBody,
} from '@shared/schemas/reviews';

const NUL = 'Lift\u0000 of the drive';
const LONE = 'Lift \ud800 of the drive';

const CASES: Array<[string, z.ZodType, (bad: string) => unknown, string]> = [
  ['package title', CreatePackageBody, (t) => ({ title: t, siteId: crypto.randomUUID() }), 'title'],
  ['draft title', SaveDraftBody, (t) => ({ title: t }), 'title'],
  ['organisation name', OrganisationBody, (t) => ({ name: t, kind: 'contractor' }), 'name'],
  [
    'site address',
    SiteBody,
    (t) => ({ name: 'North yard', code: 'NY', address: t, timeZone: 'UTC' }),
    'address',
  ],
  [
    'invited name',
    InviteBody,
    (t) => ({ email: 'a@test.example', name: t, role: 'contractor', organisationId: crypto.randomUUID() }),
    'name',
  ],
  ['profile name', ProfilePatch, (t) => ({ name: t }), 'name'],
  ['finding text', FindingBody, (t) => ({ text: t, severity: 'minor' }), 'text'],
  ['finding response', FindingUpdateBody, (t) => ({ response: t }), 'response'],
  ['accepted figure reason', AcceptFigureBody, (t) => ({ figure: 'radius', reason: t }), 'reason'],
  [
    'decision conditions',
    DecisionBody,
    (t) => ({ decision: 'accepted_as_noted', conditions: t, baseVersion: 1, password: 'pw' }),
    'conditions',
  ],
  [
    'decision override reason',
    DecisionBody,
    (t) => ({
      decision: 'accepted',
      conditions: '',
      overrideReason: `${t} — the failing check is answered by the trial lift`,
      baseVersion: 1,
      password: 'pw',
    }),
    'overrideReason',
  ],
  [
    'markup text',
    MarkupBody,
    (t) => ({
      kind: 'rectangle',
      fileId: crypto.randomUUID(),
      pageNumber: 1,
      geometry: { x: 1, y: 1, width: 10, height: 10 },
      text: t,
    }),
    'text',
  ],
];

describe('text fields of the shared schemas', () => {
  for (const [what, schema, body, field] of CASES) {
    it(`when the ${what} holds a NUL or a lone surrogate, then the schema names ${field}`, () => {
      expect(schema.safeParse(body('Lift of the drive')).success).toBe(true);
      for (const [bad, reason] of [
        [NUL, 'must not contain NUL characters'],
        [LONE, 'must not contain lone UTF-16 surrogates'],
      ] as const) {
        const parsed = schema.safeParse(body(bad));
        expect(parsed.success).toBe(false);
        const issue = parsed.error!.issues.find((i) => i.path.join('.') === field);
        expect(issue?.message).toBe(`${field} ${reason}`);
      }
    });
  }
});

describe('upload file names', () => {
  it('when a file name holds a NUL or a lone surrogate, then 400 bad_file_name names the file', () => {
    expect(checkFileName('plan.pdf')).toBe('plan.pdf');
    for (const name of ['plan\u0000.pdf', 'plan\udc00.pdf']) {
      let caught: unknown;
      try {
        checkFileName(name);
      } catch (error) {
        caught = error;
      }
      expect(caught).toBeInstanceOf(AppError);
      expect(caught).toMatchObject({ status: 400, code: 'bad_file_name' });
      expect((caught as AppError).fields![0]).toMatchObject({
        path: 'file',
        message: expect.stringMatching(/^file name must not contain/),
      });
    }
  });
});
