// Every program the product or its tests spawn must come from the install list in
// scripts/lib/services.ts (installed by `npm start` / `npm test` with apt-get), or be part
// of Node.js or of every Debian system (listed below with the reason). The scan reads the
// code in server/, worker/, scripts/ and tests/ for child_process calls and for browser
// executable paths; a call whose program is not a literal must name it in a
// `// spawns: <program>` comment just above, so nothing escapes the scan.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEBIAN_PACKAGES, findPostgresBin, which } from '../../scripts/lib/services';

/** Not installed by us, with the reason. */
const BUILT_IN: Record<string, string> = {
  node: 'process.execPath: the Node.js that runs the command itself',
  npx: 'ships with Node.js (npm)',
  runuser: 'util-linux, an Essential package of every Debian system; runs PostgreSQL as its own user',
  chown: 'coreutils, an Essential package of every Debian system',
  'apt-get': 'apt, Debian package tool: the installer itself',
  dpkg: 'dpkg, Debian package database, Essential; this test asks it who owns a program',
};

const FOLDERS = ['server', 'worker', 'scripts', 'tests'];
const CALL = /(?<![.\w])(spawn|spawnSync|execFile|execFileSync|exec|execSync|fork)\(\s*([^,)]+)/g;
const EXECUTABLE_PATH = /executablePath:\s*(['"`][^'"`]+['"`])/g;

interface Spawn {
  where: string;
  program: string | null;
}

/** The programs one source file spawns (null: not named, neither literally nor by comment). */
function spawnedIn(source: string, file: string): Spawn[] {
  const out: Spawn[] = [];
  const lines = source.split('\n');
  const usesChildProcess = /from ['"](node:)?child_process['"]/.test(source);
  const lineOf = (index: number) => source.slice(0, index).split('\n').length;
  const annotated = (line: number): string[] | null => {
    for (let l = line - 1; l >= Math.max(1, line - 3); l--) {
      const m = /\/\/ spawns: (.+)$/.exec(lines[l - 1]);
      // "// spawns: a, b (why)": the list ends at a parenthesis or a dash.
      if (m)
        return m[1]
          .split(/\(| — /)[0]
          .split(',')
          .map((p) => p.trim().split(/\s/)[0]);
    }
    return null;
  };
  const literal = (arg: string) => {
    const m = /^['"`]([^'"`$]+)['"`]$/.exec(arg.trim());
    return m ? path.basename(m[1]) : arg.trim() === 'process.execPath' ? 'node' : null;
  };
  if (usesChildProcess) {
    for (const m of source.matchAll(CALL)) {
      const line = lineOf(m.index);
      const named = literal(m[2]);
      const where = `${file}:${line}`;
      if (named) out.push({ where, program: named });
      else {
        const list = annotated(line);
        if (list) for (const program of list) out.push({ where, program });
        else out.push({ where, program: null });
      }
    }
  }
  for (const m of source.matchAll(EXECUTABLE_PATH)) {
    out.push({ where: `${file}:${lineOf(m.index)}`, program: literal(m[1]) });
  }
  return out;
}

function sourceFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    if (e.isDirectory()) return e.name === 'node_modules' ? [] : sourceFiles(p);
    return /\.(ts|tsx|js|mjs)$/.test(e.name) ? [p] : [];
  });
}

function allSpawns(): Spawn[] {
  return FOLDERS.flatMap((d) => sourceFiles(d)).flatMap((f) => spawnedIn(fs.readFileSync(f, 'utf8'), f));
}

const listed = new Map(DEBIAN_PACKAGES.flatMap((p) => p.binaries.map((b) => [b, p.name] as const)));

describe('programs the code spawns', () => {
  it('when the code is scanned, then every spawned program is named and comes from the install list or the system', () => {
    const spawns = allSpawns();
    // The scan must see the calls we know about, or it is not scanning anything.
    expect(spawns.map((s) => s.program)).toEqual(
      expect.arrayContaining(['node', 'pdftotext', 'redis-server']),
    );
    const unnamed = spawns.filter((s) => s.program === null).map((s) => s.where);
    expect(unnamed, 'calls whose program is neither a literal nor named in a "// spawns:" comment').toEqual(
      [],
    );
    const unknown = spawns
      .filter((s) => s.program && !listed.has(s.program) && !(s.program in BUILT_IN))
      .map((s) => `${s.where} spawns ${s.program}`);
    expect(unknown, 'programs missing from DEBIAN_PACKAGES in scripts/lib/services.ts').toEqual([]);
  });

  it('when a source spawns a program nobody installs, then the scan reports it', () => {
    // Built from parts so that this file's own scan does not see these calls.
    const call = (fn: string, arg: string) => `${fn}(${arg}, []);`;
    const source = [
      "import { execFileSync, spawn } from 'node:child_process';",
      call('execFileSync', "'/usr/bin/convert'"),
      call('spawn', 'tool'),
      '// spawns: gs',
      call('spawn', 'ghostscript'),
    ].join('\n');
    const found = spawnedIn(source, 'x.ts');
    expect(found).toEqual([
      { where: 'x.ts:2', program: 'convert' },
      { where: 'x.ts:3', program: null },
      { where: 'x.ts:5', program: 'gs' },
    ]);
    expect(listed.has('convert') || 'convert' in BUILT_IN).toBe(false);
  });

  it('when the test command has run its install step, then each listed program is present and owned by its Debian package', () => {
    for (const pkg of DEBIAN_PACKAGES.filter((p) => p.purposes.includes('test'))) {
      expect(pkg.present(), `${pkg.name} should have been installed by npm test`).toBe(true);
      for (const binary of pkg.binaries) {
        const file =
          pkg.name === 'postgresql'
            ? path.join(findPostgresBin()!, binary)
            : (which(binary) ?? `/usr/bin/${binary}`);
        expect(fs.existsSync(file), `${file} (from ${pkg.name})`).toBe(true);
        const owner = spawnSync('dpkg', ['-S', file], { encoding: 'utf8' });
        const owners = owner.stdout
          .split(':')[0]
          .split(',')
          .map((s) => s.trim());
        expect(
          owners.some((o) => o === pkg.name || o.startsWith(`${pkg.name}-`)),
          `${file} belongs to ${owner.stdout.trim() || owner.stderr.trim()}, not ${pkg.name}`,
        ).toBe(true);
      }
    }
  });
});
