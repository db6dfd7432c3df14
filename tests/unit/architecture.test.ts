/**
 * The house's walls, checked on the source: the import graph has no circle, and
 * no source file grows past ~300 lines unless DEVELOPERS.md names it with its
 * reason. (ESLint's no-restricted-imports enforces the direction of imports.)
 */
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const root = path.resolve(import.meta.dirname, '../..');
const folders = ['server', 'shared', 'src', 'db', 'scripts'];

function sourceFiles(dir: string): string[] {
  const out: string[] = [];
  for (const entry of fs.readdirSync(path.join(root, dir), { withFileTypes: true })) {
    const rel = path.join(dir, entry.name);
    if (entry.isDirectory()) out.push(...sourceFiles(rel));
    else if (/\.(ts|tsx)$/.test(entry.name) && !entry.name.endsWith('.d.ts')) out.push(rel);
  }
  return out;
}

const files = folders.flatMap(sourceFiles);
const fileSet = new Set(files);

/** tsconfig.json's path aliases (checked against it below), each with its folder. */
const aliases: [alias: string, folder: string][] = [
  ['@shared/', 'shared/'],
  ['@server/', 'server/'],
  ['@db/', 'db/'],
  ['@/', 'src/'],
];

/** Project imports of a file (static, re-exports, dynamic; relative or by alias), resolved to files. */
function importsOf(file: string): string[] {
  const text = fs.readFileSync(path.join(root, file), 'utf8');
  const specs = [
    ...text.matchAll(/(?:import|export)\s[^'"]*?from\s+['"]([^'"]+)['"]/g),
    ...text.matchAll(/import\s*\(\s*['"]([^'"]+)['"]\s*\)/g),
    ...text.matchAll(/^import\s+['"]([^'"]+)['"]/gm),
  ].map((m) => m[1]);
  const out: string[] = [];
  for (const spec of specs) {
    const alias = aliases.find(([a]) => spec.startsWith(a));
    if (!alias && !spec.startsWith('.')) continue;
    const base = alias
      ? alias[1] + spec.slice(alias[0].length)
      : path.normalize(path.join(path.dirname(file), spec));
    const found = ['', '.ts', '.tsx', '/index.ts', '/index.tsx']
      .map((ext) => base + ext)
      .find((c) => fileSet.has(c));
    if (found) out.push(found);
  }
  return out;
}

/** Tarjan's strongly connected components: every group of files that import each other round. */
function circles(graph: Map<string, string[]>): string[][] {
  let index = 0;
  const indexOf = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const found: string[][] = [];
  const visit = (v: string) => {
    indexOf.set(v, index);
    low.set(v, index++);
    stack.push(v);
    onStack.add(v);
    for (const w of graph.get(v) ?? []) {
      if (!indexOf.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v)!, low.get(w)!));
      } else if (onStack.has(w)) low.set(v, Math.min(low.get(v)!, indexOf.get(w)!));
    }
    if (low.get(v) === indexOf.get(v)) {
      const group: string[] = [];
      let w: string;
      do {
        w = stack.pop()!;
        onStack.delete(w);
        group.push(w);
      } while (w !== v);
      if (group.length > 1 || (graph.get(v) ?? []).includes(v)) found.push(group.sort());
    }
  };
  for (const v of graph.keys()) if (!indexOf.has(v)) visit(v);
  return found;
}

describe('the import graph', () => {
  const graph = new Map(files.map((f) => [f, importsOf(f)]));

  it('was read from the whole code base: server, client and shared', () => {
    expect(files.length).toBeGreaterThan(200);
    expect(graph.get('server/app.ts')).toContain('server/routes.ts');
    expect(graph.get('src/config/paths.ts')).toContain('shared/paths.ts');
    expect(graph.get('shared/units/index.ts')).toContain('shared/units/labels.ts');
  });

  it("reads imports by the same aliases as tsconfig.json's paths", () => {
    const tsconfig = JSON.parse(fs.readFileSync(path.join(root, 'tsconfig.json'), 'utf8'));
    const paths = Object.entries(tsconfig.compilerOptions.paths as Record<string, string[]>).map(
      ([alias, [folder]]) => [
        alias.replace(/\*$/, ''),
        folder.replace(/^\.\//, '').replace(/\*$/, ''),
      ],
    );
    expect(new Set(paths.map((p) => p.join(' ')))).toEqual(
      new Set(aliases.map((a) => a.join(' '))),
    );
    // Imports by alias are in the graph: the parts page reaches the parts ledger.
    expect(graph.get('src/app/routes/builds/parts.tsx')).toContain(
      'src/features/parts/components/parts-ledger.tsx',
    );
  });

  it('has no circle', () => {
    expect(circles(graph)).toEqual([]);
  });

  it('finds a circle when there is one (the check itself works)', () => {
    const g = new Map([
      ['a', ['b']],
      ['b', ['c']],
      ['c', ['a']],
      ['d', ['a']],
    ]);
    expect(circles(g)).toEqual([['a', 'b', 'c']]);
  });

  it('runs one way: lib and middleware never reach a feature, nothing but the entry reaches the app', () => {
    const wrong: string[] = [];
    for (const [file, deps] of graph) {
      for (const dep of deps) {
        const below = file.startsWith('server/lib/') || file.startsWith('server/middleware/');
        if (below && dep.startsWith('server/features/')) wrong.push(`${file} → ${dep}`);
        if (dep === 'server/app.ts' && file !== 'server/index.ts') wrong.push(`${file} → ${dep}`);
        if (file.startsWith('shared/') && !dep.startsWith('shared/'))
          wrong.push(`${file} → ${dep}`);
        if (file.startsWith('src/') && (dep.startsWith('server/') || dep.startsWith('db/')))
          wrong.push(`${file} → ${dep}`);
        const [, , feature] = file.split('/');
        if (file.startsWith('server/features/') && dep.startsWith('server/features/')) {
          const [, , other, rest] = dep.split('/');
          if (other !== feature && rest !== 'index.ts') wrong.push(`${file} → ${dep}`);
        }
        // A client feature reaches another only through its api/ calls.
        if (file.startsWith('src/features/') && dep.startsWith('src/features/')) {
          const [, , other, rest] = dep.split('/');
          if (other !== feature && rest !== 'api') wrong.push(`${file} → ${dep}`);
        }
        if (file.startsWith('src/features/') && dep.startsWith('src/app/'))
          wrong.push(`${file} → ${dep}`);
        // The client's lib, UI kit and config sit below the features and the app.
        if (
          /^src\/(lib|components|config)\//.test(file) &&
          (dep.startsWith('src/features/') || dep.startsWith('src/app/'))
        )
          wrong.push(`${file} → ${dep}`);
      }
    }
    expect(wrong).toEqual([]);
  });
});

describe("ESLint's walls", () => {
  // Each wall of DEVELOPERS.md tried on a file that breaks it (and one that keeps to it).
  const cases: [file: string, imports: string, fails: boolean][] = [
    ['src/features/parts/components/x.tsx', '@/features/budget/components/budget-charts', true],
    ['src/features/parts/components/x.tsx', '@/features/budget/lib/time-axis', true],
    ['src/features/parts/components/x.tsx', '../../budget/components/budget-charts', true],
    ['src/features/parts/api/x.ts', '@/app/router', true],
    ['src/features/parts/components/x.tsx', '@/features/budget/api/get-budget', false],
    ['src/features/parts/components/x.tsx', '../lib/status', false],
    ['src/components/ui/x.tsx', '@/features/parts/api/get-parts', true],
    ['src/app/routes/builds/x.tsx', '@server/app', true],
    ['src/app/routes/builds/x.tsx', '@db/knexfile', true],
    ['shared/x.ts', '@/lib/dates', true],
    ['shared/x.ts', '../server/lib/errors', true],
    ['shared/x.ts', './dates', false],
    ['server/features/parts/x.ts', '@server/features/budget/budget.service', true],
    ['server/features/parts/x.ts', '@server/features/budget', false],
    ['server/features/parts/x.ts', '@server/app', true],
    ['server/lib/x.ts', '@server/features/parts', true],
    ['server/lib/x.ts', './errors', false],
    ['db/migrations/x.ts', '@shared/format', true],
    // Leaving a feature's folder (or any folder outside a feature) goes by alias, not '../'.
    ['src/lib/x.ts', '../components/ui/button', true],
    ['src/lib/x.ts', '@/components/ui/button', false],
    ['src/lib/x.ts', '@/features/auth/api/sign-out', true],
    ['src/components/ui/x.tsx', '@/app/router', true],
    ['server/features/parts/x.ts', '../../lib/errors', true],
  ];

  it(
    'fail the lint for each import against the house, and only those',
    { timeout: 60_000 },
    async () => {
      const { ESLint } = await import('eslint');
      const eslint = new ESLint({ cwd: root });
      const verdicts: string[] = [];
      for (const [file, spec, fails] of cases) {
        const code = `import { a } from '${spec}';\nexport const b = a;\n`;
        const [result] = await eslint.lintText(code, { filePath: path.join(root, file) });
        const walls = result.messages.filter((m) =>
          ['no-restricted-imports', 'house/walls'].includes(m.ruleId ?? ''),
        );
        if (walls.length > 0 !== fails) verdicts.push(`${file} importing ${spec}`);
      }
      expect(verdicts).toEqual([]);
    },
  );
});

describe('file size', () => {
  it('keeps source files under ~300 lines, or DEVELOPERS.md says why', () => {
    const guide = fs.readFileSync(path.join(root, 'DEVELOPERS.md'), 'utf8');
    const listed = new Set([...guide.matchAll(/^\|\s*`([^`]+\.tsx?)`\s*\|/gm)].map((m) => m[1]));
    const long = files.filter((f) => {
      if (f.startsWith('shared/schemas/') || f.startsWith('db/seeds/')) return false;
      return fs.readFileSync(path.join(root, f), 'utf8').split('\n').length > 320;
    });
    expect(long.filter((f) => !listed.has(f))).toEqual([]);
  });
});
