// The text of each message: plain text and HTML, a link back to the page, no secrets
// (the invitation link is the one exception: it is the person's own one-time link, and the
// stored message holds a placeholder for it, see sealed-link.ts).
import { DECISION_LABELS, type Decision } from '@shared/schemas/common';
import { STANDING_CAUTION } from '@shared/vocabulary/cautions';
import type { MailEvent } from './mail.entity';

export interface Rendered {
  subject: string;
  text: string;
  html: string;
}

interface PackageRef {
  reference: string;
  title: string;
  site: string;
  plannedLiftDate: string | null;
  url: string;
}

export function escape(s: string) {
  return s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );
}

const FOOTER = STANDING_CAUTION;

function render(
  subject: string,
  greeting: string,
  lines: string[],
  link: { url: string; label: string },
): Rendered {
  const text = [greeting, '', ...lines, '', `${link.label}: ${link.url}`, '', '—', FOOTER].join('\n');
  const html = `<!doctype html><html><body style="font-family:Lato,Arial,sans-serif;color:#16191c;line-height:1.45">
<p>${escape(greeting)}</p>
${lines.map((l) => `<p>${escape(l)}</p>`).join('\n')}
<p><a href="${escape(link.url)}" style="color:#0f5f5b;font-weight:bold">${escape(link.label)}</a></p>
<hr style="border:none;border-top:1px solid #d9d5cb"><p style="font-size:12px;color:#4a4f55">${escape(FOOTER)}</p>
</body></html>`;
  return { subject, text, html };
}

/** A person's text in a message: whole up to 600 characters, else cut at a word with an ellipsis. */
const clip = (text: string) => {
  const t = text.trim().replace(/\s+/g, ' ');
  return t.length <= 600 ? t : `${t.slice(0, 600).replace(/\s+\S*$/, '')}…`;
};

const when = (p: PackageRef) =>
  p.plannedLiftDate ? `planned lift date ${p.plannedLiftDate}` : 'no lift date set';

export const templates = {
  submitted: (to: string, p: PackageRef, revision: number): Rendered =>
    render(
      `${p.reference} rev ${revision} submitted for review — ${p.title}`,
      `Hello ${to},`,
      [
        `${p.reference} "${p.title}" at ${p.site} was submitted as revision ${revision} (${when(p)}).`,
        'The independent check runs now; the package appears in your queue when it is done.',
      ],
      { url: p.url, label: 'Open the package' },
    ),
  resubmitted: (to: string, p: PackageRef, revision: number): Rendered =>
    render(
      `${p.reference} resubmitted as revision ${revision} — ${p.title}`,
      `Hello ${to},`,
      [
        `The contractor resubmitted ${p.reference} "${p.title}" as revision ${revision} (${when(p)}).`,
        'Your findings on the previous revision are carried over with their answers.',
      ],
      { url: p.url, label: 'Open the package' },
    ),
  assigned: (to: string, p: PackageRef, by: string, note?: string | null): Rendered =>
    render(
      `${p.reference} assigned to you for review — ${p.title}`,
      `Hello ${to},`,
      [
        `${by} assigned ${p.reference} "${p.title}" at ${p.site} to you as engineer of record (${when(p)}).`,
        ...(note ? [`${by}'s note: ${note}`] : []),
      ],
      { url: p.url, label: 'Open the package' },
    ),
  decided: (
    to: string,
    p: PackageRef,
    revision: number,
    decision: Decision,
    engineer: string,
    conditions: string,
  ): Rendered =>
    render(
      `${p.reference} rev ${revision}: ${DECISION_LABELS[decision]}, ready to issue — ${p.title}`,
      `Hello ${to},`,
      [
        `${engineer} recorded the decision on ${p.reference} "${p.title}" revision ${revision} at ${p.site}: ${DECISION_LABELS[decision]} (${when(p)}).`,
        ...(conditions ? [`Conditions: ${conditions}`] : []),
        'The stamped return is yours to issue next: check the stamp and the first page, then issue it from the package page.',
      ],
      { url: p.url, label: 'Open the package' },
    ),
  answered: (
    to: string,
    p: PackageRef,
    by: string,
    finding: { number: number; text: string; response: string },
  ): Rendered =>
    render(
      `${p.reference}: finding ${finding.number} answered — ${p.title}`,
      `Hello ${to},`,
      [
        `${by} answered finding ${finding.number} on ${p.reference} "${p.title}" at ${p.site}.`,
        `Finding: ${clip(finding.text)}`,
        `Answer: ${clip(finding.response)}`,
        'Close the finding or reopen it from the review workspace once the next revision is submitted.',
      ],
      { url: p.url, label: 'Open the package' },
    ),
  returned: (
    to: string,
    p: PackageRef,
    revision: number,
    decision: Decision,
    conditions: string,
    fileUrl: string,
  ): Rendered =>
    render(
      `${p.reference} rev ${revision}: ${DECISION_LABELS[decision]} — ${p.title}`,
      `Hello ${to},`,
      [
        `The review of ${p.reference} "${p.title}" revision ${revision} is returned: ${DECISION_LABELS[decision]}.`,
        ...(conditions ? [`Conditions: ${conditions}`] : []),
        `The stamped PDF: ${fileUrl}`,
        ...(decision === 'revise_and_resubmit' || decision === 'rejected'
          ? ['Answer the findings and start the next revision from the package page.']
          : []),
      ],
      { url: p.url, label: 'Open the package' },
    ),
  reminder: (to: string, p: PackageRef, days: number, status: string): Rendered =>
    render(
      `${p.reference} lifts ${days === 0 ? 'today' : days === 1 ? 'tomorrow' : `in ${days} days`} and is not yet accepted — ${p.title}`,
      `Hello ${to},`,
      [
        `${p.reference} "${p.title}" at ${p.site} has its ${when(p)} and is not yet accepted (now: ${status}).`,
      ],
      { url: p.url, label: 'Open the package' },
    ),
  review_due: (to: string, p: PackageRef, dueOn: string, today: string, status: string): Rendered =>
    render(
      `${p.reference} review ${dueOn < today ? `overdue since ${dueOn}` : dueOn === today ? 'due today' : 'due tomorrow'} — ${p.title}`,
      `Hello ${to},`,
      [
        `The review of ${p.reference} "${p.title}" at ${p.site} is due ${dueOn} (the site's review turnaround, or its margin before the lift; ${when(p)}). Now: ${status}.`,
      ],
      { url: p.url, label: 'Open the package' },
    ),
  invite: (to: string, organisation: string, inviter: string, url: string, expires: string): Rendered =>
    render(
      `You are invited to the Counterpoise lift review desk`,
      `Hello ${to},`,
      [
        `${inviter} invited you to the lift review desk for ${organisation}.`,
        `Set your password with this one-time link before ${expires}.`,
      ],
      { url, label: 'Set your password' },
    ),
} satisfies Record<MailEvent, (...args: never[]) => Rendered>;
