// Live updates for open pages. PostgreSQL announces every committed change to a package (and
// every hand-off mail written for a person) on the channel cp_live (migration
// LiveUpdates1764724100000), whichever process made it: an API, a worker, a migration. Each API
// process holds one listening connection while at least one page is subscribed, and passes
// each announcement to the pages whose person may see that package — the same rule as
// package-scope.ts — or, for a hand-off, to its recipient. Nothing is kept in the process that
// another process would need: a page that reconnects to another API process misses nothing
// it cannot read again.
import pg from 'pg';
import type { Actor } from '@shared/rules/actor';
import { logger } from '../../lib/logger';

export type LiveAnnouncement =
  | {
      t: 'package';
      id: string;
      site: string;
      org: string;
      owner: string;
      engineer: string | null;
      previousEngineer: string | null;
      firstDraft: boolean;
    }
  | { t: 'handoff'; user: string };

export interface LiveSubscriber {
  actor: Actor;
  /** The sites a coordinator serves (read when the page subscribes). */
  sites: ReadonlySet<string>;
  send(event: 'package' | 'handoff', data: object): void;
  /** Close the page's stream (its browser reconnects by itself). */
  end(): void;
}

/** Whether `s` may hear of the announcement: the rule of package-scope.ts, in memory. */
export function mayHear(s: Pick<LiveSubscriber, 'actor' | 'sites'>, a: LiveAnnouncement): boolean {
  if (a.t === 'handoff') return a.user === s.actor.id;
  switch (s.actor.role) {
    case 'contractor':
      return a.org === s.actor.organisationId;
    case 'reviewer':
      return !a.firstDraft && s.sites.has(a.site);
    case 'engineer':
      return !a.firstDraft && (a.engineer === s.actor.id || a.previousEngineer === s.actor.id);
    case 'admin':
      return !a.firstDraft && a.owner === s.actor.organisationId;
  }
}

export class LiveHub {
  private readonly subscribers = new Set<LiveSubscriber>();
  private client: pg.Client | null = null;
  private connecting: Promise<void> | null = null;

  constructor(private readonly databaseUrl: string) {}

  async subscribe(s: LiveSubscriber): Promise<() => void> {
    this.subscribers.add(s);
    await this.listen();
    return () => {
      this.subscribers.delete(s);
      if (this.subscribers.size === 0) void this.stop();
    };
  }

  get size() {
    return this.subscribers.size;
  }

  private listen(): Promise<void> {
    if (this.client) return Promise.resolve();
    this.connecting ??= (async () => {
      const client = new pg.Client({
        connectionString: this.databaseUrl,
        application_name: 'counterpoise-live',
      });
      client.on('notification', (n) => this.deliver(n.payload));
      client.on('error', (err) => {
        logger.warn({ err }, 'live updates: the listening connection failed; pages reconnect');
        if (this.client === client) this.client = null;
        // Each page's stream ends; the browser's EventSource reconnects and listens again.
        for (const s of [...this.subscribers]) s.end();
      });
      await client.connect();
      await client.query('LISTEN cp_live');
      this.client = client;
    })().finally(() => {
      this.connecting = null;
    });
    return this.connecting;
  }

  private deliver(payload: string | undefined) {
    let a: LiveAnnouncement;
    try {
      a = JSON.parse(payload ?? '') as LiveAnnouncement;
    } catch {
      return;
    }
    for (const s of this.subscribers) {
      if (!mayHear(s, a)) continue;
      if (a.t === 'package') s.send('package', { packageId: a.id });
      else s.send('handoff', {});
    }
  }

  /** Stop listening once no page is subscribed. */
  async stop() {
    if (this.subscribers.size > 0) return;
    const client = this.client;
    this.client = null;
    await client?.end().catch(() => undefined);
  }
}
