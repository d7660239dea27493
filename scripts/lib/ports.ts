// Which program holds a TCP port, read from /proc (Linux) so a taken port can be named
// with its owner ("taken by redis-server, pid 4121") without spawning ss or lsof.
import fs from 'node:fs';
import net from 'node:net';

interface Owner {
  pid: number;
  command: string;
}

function listeningInodes(port: number): Set<string> {
  const inodes = new Set<string>();
  for (const file of ['/proc/net/tcp', '/proc/net/tcp6']) {
    let text: string;
    try {
      text = fs.readFileSync(file, 'utf8');
    } catch {
      continue;
    }
    for (const line of text.split('\n').slice(1)) {
      const cols = line.trim().split(/\s+/);
      if (cols.length < 10) continue;
      const localPort = parseInt(cols[1].split(':')[1] ?? '', 16);
      // State 0A is LISTEN.
      if (localPort === port && cols[3] === '0A') inodes.add(cols[9]);
    }
  }
  return inodes;
}

/** The process listening on the port, when this user may see it. */
export function portOwner(port: number): Owner | null {
  const inodes = listeningInodes(port);
  if (!inodes.size) return null;
  let pids: string[];
  try {
    pids = fs.readdirSync('/proc').filter((d) => /^\d+$/.test(d));
  } catch {
    return null;
  }
  for (const pid of pids) {
    let fds: string[];
    try {
      fds = fs.readdirSync(`/proc/${pid}/fd`);
    } catch {
      continue;
    }
    for (const fd of fds) {
      let target: string;
      try {
        target = fs.readlinkSync(`/proc/${pid}/fd/${fd}`);
      } catch {
        continue;
      }
      const m = /^socket:\[(\d+)\]$/.exec(target);
      if (m && inodes.has(m[1])) return { pid: Number(pid), command: commandOf(Number(pid)) };
    }
  }
  return null;
}

export function commandOf(pid: number): string {
  try {
    const argv = fs.readFileSync(`/proc/${pid}/cmdline`, 'utf8').split('\0').filter(Boolean);
    // node --import tsx scripts/start.ts reads better as "node scripts/start.ts".
    const script = argv.find((a) => /\.(ts|js|mjs|cjs)$/.test(a));
    const exe = (argv[0] ?? '').split('/').pop() ?? '';
    return script && exe === 'node' ? `node ${script}` : exe || 'an unknown program';
  } catch {
    return 'an unknown program';
  }
}

/** "port 3000 on 127.0.0.1 is taken by node scripts/start.ts (pid 812)". */
export async function describePort(port: number): Promise<string> {
  const owner = portOwner(port);
  return owner
    ? `port ${port} on 127.0.0.1 is taken by ${owner.command} (pid ${owner.pid})`
    : `port ${port} on 127.0.0.1 is taken by another program`;
}

/** The first taken port of the list, described; null when all are free. */
export async function firstTakenPort(
  ports: Array<{ port: number; variable: string }>,
): Promise<string | null> {
  for (const p of ports) {
    if (!(await isPortFree(p.port)))
      return `${await describePort(p.port)}; stop it or set ${p.variable} to another port`;
  }
  return null;
}

export async function isPortFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const server = net.createServer();
    server.once('error', () => resolve(false));
    server.listen(port, '127.0.0.1', () => server.close(() => resolve(true)));
  });
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      server.close(() => resolve(port));
    });
  });
}
