// Who changed a site's policy, when, and from what to what — the audit trail an owner's
// auditor asks for.
import { formatDateTime } from '@/lib/format';
import type { PolicyResponse } from '../api/site-policy';
import { changedFields, formatPolicyValue } from '../lib/policy-fields';
import { POLICY_DEFAULTS } from '@shared/schemas/site-policy';

function actorName(actor: PolicyResponse['history'][number]['actor']): string {
  if (!actor) return 'Unknown';
  return typeof actor === 'string' ? actor : actor.name;
}

export function PolicyHistory({ history }: { history: PolicyResponse['history'] }) {
  if (history.length === 0) {
    return (
      <p className="text-[13px] text-ink-soft">
        No changes yet: this site has used the defaults since it was set up.
      </p>
    );
  }
  const newestFirst = [...history].sort((a, b) => b.at.localeCompare(a.at));
  return (
    <ol className="flex flex-col gap-2.5">
      {newestFirst.map((entry, index) => {
        const changes = changedFields(entry.before ?? {}, entry.after ?? {});
        return (
          <li key={`${entry.at}-${index}`} className="border-l-2 border-rule-strong pl-3">
            <p className="text-[13px]">
              <time dateTime={entry.at} className="font-bold tabular">
                {formatDateTime(entry.at)}
              </time>{' '}
              <span className="text-ink-soft">by {actorName(entry.actor)}</span>
            </p>
            {changes.length === 0 ? (
              <p className="text-[12.5px] text-ink-soft">Saved without changes.</p>
            ) : (
              <ul className="mt-0.5 text-[12.5px] leading-relaxed">
                {changes.map(({ field, from, to }) => (
                  <li key={field.name}>
                    <span className="text-ink-soft">{field.label ?? POLICY_DEFAULTS[field.key].label}:</span>{' '}
                    {from === undefined ? 'default' : formatPolicyValue(from, field)} →{' '}
                    <strong>
                      {to === undefined
                        ? `default (${formatPolicyValue(
                            field.sub
                              ? (POLICY_DEFAULTS.tandemMarginPct.value[field.sub] as number)
                              : POLICY_DEFAULTS[field.key].value,
                            field,
                          )})`
                        : formatPolicyValue(to, field)}
                    </strong>
                  </li>
                ))}
              </ul>
            )}
          </li>
        );
      })}
    </ol>
  );
}
