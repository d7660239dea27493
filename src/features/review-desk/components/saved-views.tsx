// Named queue views: save the filters on now under a name, pick one again with a click.
// Only the filters are kept (in this browser), so a view always shows today's rows.
import { useState, type FormEvent } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { readViews, storageKey, viewSearch, withView, writeViews, type SavedView } from '../lib/saved-views';

export function SavedViews({ userId, scope }: { userId: string; scope: string }) {
  const key = storageKey(userId, scope);
  const [params, setParams] = useSearchParams();
  const [views, setViews] = useState<SavedView[]>(() => readViews(key));
  const [naming, setNaming] = useState(false);
  const [name, setName] = useState('');
  const [note, setNote] = useState<string | null>(null);
  const current = viewSearch(params);

  function store(next: SavedView[], message: string) {
    setViews(next);
    setNote(
      writeViews(key, next) ? message : 'This browser would not keep the view (storage is full or off).',
    );
  }

  function onSave(event: FormEvent) {
    event.preventDefault();
    const trimmed = name.trim().slice(0, 60);
    if (!trimmed) return;
    store(withView(views, { name: trimmed, search: current }), `Saved “${trimmed}”.`);
    setNaming(false);
    setName('');
  }

  return (
    <div
      role="group"
      aria-label="Saved views"
      className="mb-3 flex flex-wrap items-center gap-1.5 text-[13px]"
    >
      <span className="mr-1 text-[12px] font-bold uppercase tracking-[0.06em] text-ink-soft">
        Saved views
      </span>
      {views.length === 0 && !naming && (
        <span className="text-ink-soft">None yet — set the filters, then save them here.</span>
      )}
      {views.map((view) => {
        const active = view.search === current;
        return (
          <span
            key={view.name}
            className={`inline-flex items-stretch overflow-hidden rounded-[3px] border ${
              active ? 'border-ink bg-ink text-chalk' : 'border-rule-strong bg-sheet'
            }`}
          >
            <button
              type="button"
              aria-pressed={active}
              onClick={() => {
                setNote(null);
                setParams(new URLSearchParams(view.search));
              }}
              className={`px-2 py-0.5 font-bold ${active ? '' : 'hover:bg-sheet-alt'}`}
            >
              {view.name}
            </button>
            <button
              type="button"
              aria-label={`Delete the view ${view.name}`}
              title={`Delete “${view.name}”`}
              onClick={() =>
                store(
                  views.filter((v) => v.name !== view.name),
                  `Deleted “${view.name}”.`,
                )
              }
              className={`border-l px-1.5 ${active ? 'border-chalk/40' : 'border-rule text-ink-soft hover:bg-sheet-alt hover:text-ink'}`}
            >
              ×
            </button>
          </span>
        );
      })}
      {naming ? (
        <form onSubmit={onSave} className="inline-flex items-center gap-1.5">
          <label className="sr-only" htmlFor="saved-view-name">
            Name of the view
          </label>
          <input
            id="saved-view-name"
            autoFocus
            value={name}
            maxLength={60}
            onChange={(event) => setName(event.target.value)}
            onKeyDown={(event) => {
              if (event.key === 'Escape') setNaming(false);
            }}
            placeholder="e.g. Critical, lifting this week"
            className="h-7 w-60 rounded-[3px] border border-rule-strong bg-sheet px-2 text-[13px]"
          />
          <Button size="sm" variant="primary" type="submit" disabled={!name.trim()}>
            Save view
          </Button>
          <Button size="sm" variant="quiet" onClick={() => setNaming(false)}>
            Cancel
          </Button>
        </form>
      ) : (
        <Button size="sm" variant="quiet" onClick={() => setNaming(true)} disabled={views.length >= 20}>
          + Save these filters
        </Button>
      )}
      {note && (
        <span role="status" className="text-ink-soft">
          {note}
        </span>
      )}
    </div>
  );
}
