// One crane: its fixed data, its configurations, and a new configuration with its chart.
import { useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { CRANE_TYPE_LABELS, WORKING_AREA_LABELS, type CraneDetail } from '@shared/schemas/library';
import type { UnitSystem } from '@shared/schemas/common';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { PageLoading } from '@/components/ui/page-loading';
import { ErrorPanel } from '@/components/ui/panel-message';
import { useCrane } from '../api/cranes';
import { useCreateConfiguration } from '../api/configurations';
import { ConfigurationForm } from './configuration-form';

const qty = (x?: { value: number; unit: string }) => (x ? `${x.value} ${x.unit}` : '—');

function FixedData({ crane }: { crane: CraneDetail }) {
  const f = crane.fixed;
  const rows: [string, string][] = [
    [
      crane.type === 'mobile_crawler' ? 'Carbody' : 'Carrier',
      f.carrier ? `${qty(f.carrier.weight)}, CG ${qty(f.carrier.cgRearOfRotation)} rear of rotation` : '—',
    ],
    [
      'Upper works',
      f.upperWorks
        ? `${qty(f.upperWorks.weight)}, CG ${qty(f.upperWorks.cgBehindRotation)} behind rotation`
        : '—',
    ],
    ['Boom', f.boom ? `${qty(f.boom.weight)}, CG ${qty(f.boom.cgFromFoot)} from foot` : '—'],
    ['Boom pivot', `${qty(f.pivotOffset)} ahead of rotation, ${qty(f.pivotHeight)} high`],
    ...(f.outriggerSpreads ?? []).map((s): [string, string] => [
      `Spread “${s.name}”`,
      `${qty(s.longitudinalSpread)} along × ${qty(s.transverseSpread)} across`,
    ]),
    ...(f.tracks
      ? [
          [
            'Tracks',
            `${qty(f.tracks.length)} long, shoes ${qty(f.tracks.shoeWidth)}, gauge ${qty(f.tracks.gauge)}`,
          ] as [string, string],
        ]
      : []),
  ];
  return (
    <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 border border-rule bg-sheet p-3 text-[13.5px]">
      {rows.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="font-bold">{k}</dt>
          <dd>{v}</dd>
        </div>
      ))}
    </dl>
  );
}

export function CraneView({ id, system }: { id: string; system: UnitSystem }) {
  const crane = useCrane(id);
  const create = useCreateConfiguration(id);
  const [adding, setAdding] = useState(false);
  const navigate = useNavigate();
  if (crane.isPending) return <PageLoading label="Reading the crane" />;
  if (crane.isError)
    return (
      <ErrorPanel
        title="The crane could not be read"
        message={isApiError(crane.error) ? crane.error.message : 'Try again.'}
      />
    );
  const c = crane.data;
  return (
    <div className="flex flex-col gap-4">
      <p className="text-sm text-ink-soft">
        {c.make} {c.model} · {CRANE_TYPE_LABELS[c.type]}
      </p>
      <FixedData crane={c} />
      <section aria-label="Configurations" className="flex flex-col gap-2">
        <h2 className="text-base font-bold">Configurations</h2>
        {c.configurations.length === 0 && (
          <p className="text-sm text-ink-soft">No configuration yet: add one with its load chart.</p>
        )}
        <ul className="flex flex-col gap-1">
          {c.configurations.map((k) => (
            <li key={k.id} className="text-sm">
              <Link
                to={`/library/configurations/${k.id}`}
                className="font-bold text-verdigris underline underline-offset-2"
              >
                {k.name}
              </Link>{' '}
              <span className="text-ink-soft">
                version {k.current.number} · {WORKING_AREA_LABELS[k.workingArea]}
                {k.current.verified && ' · ✓ verified by your desk'}
              </span>
            </li>
          ))}
        </ul>
        {!adding ? (
          <div>
            <Button variant="primary" onClick={() => setAdding(true)}>
              + New configuration
            </Button>
          </div>
        ) : (
          <ConfigurationForm
            system={system}
            fixed={c.fixed}
            withName
            submitLabel="Save the configuration"
            busy={create.isPending}
            serverErrors={
              isApiError(create.error)
                ? create.error.fields.map((f) => ({ ...f, path: f.path.replace(/^version\./, '') }))
                : undefined
            }
            onSubmit={(version, name) =>
              create.mutate(
                { name, version },
                { onSuccess: (k) => navigate(`/library/configurations/${k.id}`) },
              )
            }
          />
        )}
        {create.isError && (
          <ErrorPanel
            title="The configuration was not saved"
            message={isApiError(create.error) ? create.error.message : 'Try again.'}
          />
        )}
      </section>
    </div>
  );
}
