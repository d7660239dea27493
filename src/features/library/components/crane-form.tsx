// Add a crane to the fleet: make and model as the contractor writes them, fleet number, type,
// and the fixed data (carrier or carbody, upper works, boom, pivot, the outrigger spreads or
// the tracks). Checked with the shared schema before it is sent; errors name the field.
import { useState } from 'react';
import { CraneBody, CRANE_TYPE_LABELS } from '@shared/schemas/library';
import { CRANE_TYPES } from '@shared/schemas/lift-input';
import type { UnitSystem } from '@shared/schemas/common';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { inputClasses, selectClasses } from '@/components/ui/form-field';
import { zodFieldErrors } from '../lib/zod-fields';
import { useCreateCrane } from '../api/cranes';
import { fieldError, QuantityField, type Q } from './quantity-field';

type Spread = { name: string; longitudinalSpread: Q; transverseSpread: Q };

export function CraneForm({ system, onDone }: { system: UnitSystem; onDone: (id: string) => void }) {
  const create = useCreateCrane();
  const [f, setF] = useState({
    fleetNumber: '',
    make: '',
    model: '',
    type: 'mobile_outriggers' as (typeof CRANE_TYPES)[number],
  });
  const [q, setQ] = useState<Record<string, Q>>({});
  const [spreads, setSpreads] = useState<Spread[]>([
    { name: 'full', longitudinalSpread: undefined, transverseSpread: undefined },
  ]);
  const [errors, setErrors] = useState<{ path: string; message: string }[]>([]);
  const set = (k: string) => (v: Q) => setQ((x) => ({ ...x, [k]: v }));
  const pair = (w: string, cg: string, cgName: string) =>
    q[w] && q[cg] ? { weight: q[w], [cgName]: q[cg] } : undefined;

  const submit = () => {
    const body = {
      ...f,
      fixed: {
        carrier: pair('carrier.weight', 'carrier.cg', 'cgRearOfRotation'),
        upperWorks: pair('upper.weight', 'upper.cg', 'cgBehindRotation'),
        boom: q['boom.weight'] ? { weight: q['boom.weight'], cgFromFoot: q['boom.cg'] } : undefined,
        pivotOffset: q.pivotOffset,
        pivotHeight: q.pivotHeight,
        outriggerSpreads:
          f.type === 'mobile_outriggers'
            ? spreads.filter((s) => s.longitudinalSpread || s.transverseSpread)
            : undefined,
        tracks:
          f.type === 'mobile_crawler' && q['tracks.length']
            ? { length: q['tracks.length'], shoeWidth: q['tracks.shoeWidth'], gauge: q['tracks.gauge'] }
            : undefined,
      },
    };
    const parsed = CraneBody.safeParse(body);
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors([]);
    create.mutate(parsed.data, {
      onSuccess: (c) => onDone(c.id),
      onError: (e) =>
        setErrors(
          isApiError(e) ? (e.fields.length ? e.fields : [{ path: '(root)', message: e.message }]) : [],
        ),
    });
  };
  const qf = (label: string, key: string, kind: 'length' | 'weight', path = key) => (
    <QuantityField
      label={label}
      value={q[key]}
      onChange={set(key)}
      kind={kind}
      system={system}
      error={fieldError(errors, `fixed.${path}`)}
    />
  );
  const text = (label: string, key: 'fleetNumber' | 'make' | 'model') => (
    <label className="flex flex-col gap-1 text-[13px] font-bold">
      {label}
      <input
        className={inputClasses}
        value={f[key]}
        aria-invalid={!!fieldError(errors, key)}
        onChange={(e) => setF((x) => ({ ...x, [key]: e.target.value }))}
      />
      {fieldError(errors, key) && (
        <span className="text-[12.5px] text-failed-ink">{fieldError(errors, key)}</span>
      )}
    </label>
  );
  return (
    <form
      aria-label="Add a crane"
      className="flex flex-col gap-3 border border-rule bg-sheet p-4"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <div className="grid gap-3 md:grid-cols-4">
        {text('Fleet number', 'fleetNumber')}
        {text('Make', 'make')}
        {text('Model', 'model')}
        <label className="flex flex-col gap-1 text-[13px] font-bold">
          Stands on
          <select
            className={selectClasses}
            value={f.type}
            onChange={(e) => setF((x) => ({ ...x, type: e.target.value as typeof f.type }))}
          >
            {CRANE_TYPES.map((t) => (
              <option key={t} value={t}>
                {CRANE_TYPE_LABELS[t]}
              </option>
            ))}
          </select>
        </label>
      </div>
      <fieldset className="grid gap-3 md:grid-cols-4">
        <legend className="mb-1 text-sm font-bold">Fixed data (the same in every configuration)</legend>
        {qf(
          f.type === 'mobile_crawler' ? 'Carbody mass' : 'Carrier mass',
          'carrier.weight',
          'weight',
          'carrier',
        )}
        {qf('Its CG rear of rotation', 'carrier.cg', 'length', 'carrier')}
        {qf('Upper works mass', 'upper.weight', 'weight', 'upperWorks')}
        {qf('Its CG behind rotation', 'upper.cg', 'length', 'upperWorks')}
        {qf('Boom mass', 'boom.weight', 'weight', 'boom')}
        {qf('Boom CG from foot', 'boom.cg', 'length', 'boom')}
        {qf('Boom pivot ahead of rotation', 'pivotOffset', 'length')}
        {qf('Boom pivot height', 'pivotHeight', 'length')}
      </fieldset>
      {f.type === 'mobile_outriggers' && (
        <fieldset className="flex flex-col gap-2">
          <legend className="mb-1 text-sm font-bold">Outrigger spread settings</legend>
          {spreads.map((s, i) => (
            <div key={i} className="grid items-end gap-3 md:grid-cols-4">
              <label className="flex flex-col gap-1 text-[13px] font-bold">
                Setting name
                <input
                  className={inputClasses}
                  value={s.name}
                  onChange={(e) =>
                    setSpreads((x) => x.map((y, k) => (k === i ? { ...y, name: e.target.value } : y)))
                  }
                />
              </label>
              <QuantityField
                label="Beam centres, along"
                value={s.longitudinalSpread}
                kind="length"
                system={system}
                onChange={(v) =>
                  setSpreads((x) => x.map((y, k) => (k === i ? { ...y, longitudinalSpread: v } : y)))
                }
                error={fieldError(errors, `fixed.outriggerSpreads.${i}`)}
              />
              <QuantityField
                label="Beam centres, across"
                value={s.transverseSpread}
                kind="length"
                system={system}
                onChange={(v) =>
                  setSpreads((x) => x.map((y, k) => (k === i ? { ...y, transverseSpread: v } : y)))
                }
              />
            </div>
          ))}
          <div>
            <Button
              size="sm"
              variant="quiet"
              onClick={() =>
                setSpreads((x) => [
                  ...x,
                  { name: '', longitudinalSpread: undefined, transverseSpread: undefined },
                ])
              }
            >
              + Another spread setting
            </Button>
          </div>
        </fieldset>
      )}
      {f.type === 'mobile_crawler' && (
        <fieldset className="grid gap-3 md:grid-cols-4">
          <legend className="mb-1 text-sm font-bold">Tracks</legend>
          {qf('Track length (tumbler centres)', 'tracks.length', 'length', 'tracks')}
          {qf('Shoe width', 'tracks.shoeWidth', 'length', 'tracks')}
          {qf('Track gauge', 'tracks.gauge', 'length', 'tracks')}
        </fieldset>
      )}
      {errors.some((e) => e.path === '(root)') && (
        <p role="alert" className="text-sm font-bold text-failed-ink">
          {errors.find((e) => e.path === '(root)')!.message}
        </p>
      )}
      <div>
        <Button type="submit" variant="primary" disabled={create.isPending}>
          {create.isPending ? 'Adding…' : 'Add the crane'}
        </Button>
      </div>
    </form>
  );
}
