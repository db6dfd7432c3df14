/**
 * The house's walls (DEVELOPERS.md) as one ESLint rule, judged on resolved paths: a
 * specifier alone cannot say whose file it reaches, and the same file may be named by a
 * path alias (`@/`, `@shared/`, `@server/`, `@db/`, from tsconfig.json) or a relative path.
 * Imports run one way, app → features → lib → shared.
 */
import path from 'node:path';

const root = import.meta.dirname;

/** tsconfig.json's path aliases, longest first. */
export const aliases = [
  ['@shared/', 'shared/'],
  ['@server/', 'server/'],
  ['@db/', 'db/'],
  ['@/', 'src/'],
];

/** The project path (`src/lib/dates`) an import names, or null for a package. */
export function resolveImport(file, spec) {
  for (const [alias, dir] of aliases)
    if (spec.startsWith(alias)) return dir + spec.slice(alias.length);
  if (spec.startsWith('.'))
    return path.posix.normalize(path.posix.join(path.posix.dirname(file), spec));
  return null;
}

const featureOf = (p) => /^(src|server)\/features\/([^/]+)(?:\/(.*))?$/.exec(p);

/** What is wrong with `file` importing `target` (both project paths), or null. */
function wallBroken(file, target) {
  const top = file.split('/')[0];
  const targetTop = target.split('/')[0];
  if (file.startsWith('db/migrations/') && ['server', 'src', 'shared'].includes(targetTop))
    return 'migration';
  if (top === 'shared' && targetTop !== 'shared') return 'shared';
  if (top === 'src' && (targetTop === 'server' || targetTop === 'db')) return 'client';
  if (top === 'server') {
    const under = /^server\/(lib|middleware|features)\//.test(file);
    if (under && /^server\/(app|routes)(\.ts)?$/.test(target)) return 'app';
    const below = file.startsWith('server/lib/') || file.startsWith('server/middleware/');
    if (below && target.startsWith('server/features/')) return 'below';
    const own = featureOf(file);
    const other = featureOf(target);
    if (own && other && other[1] === 'server' && other[2] !== own[2]) {
      const rest = (other[3] ?? '').replace(/\.ts$/, '');
      if (rest !== '' && rest !== 'index') return 'serverFeature';
    }
  }
  if (top === 'src') {
    const own = featureOf(file);
    const kit = file.startsWith('src/components/ui/');
    const other = featureOf(target);
    if ((own || kit) && target.startsWith('src/app/')) return 'clientApp';
    if (kit && other) return 'kit';
    const base = /^src\/(lib|components|config)\//.test(file);
    if (base && (other || target.startsWith('src/app/'))) return 'clientBase';
    if (own && other && other[2] !== own[2] && !(other[3] ?? '').startsWith('api/'))
      return 'clientFeature';
  }
  return null;
}

/** A relative import may move about inside its feature; anything further goes by alias. */
function climbsOut(file, spec, target) {
  if (!spec.startsWith('../')) return false;
  const own = featureOf(file);
  if (!own) return true;
  return !target.startsWith(`${own[1]}/features/${own[2]}/`);
}

const walls = {
  meta: {
    type: 'problem',
    schema: [],
    messages: {
      migration: 'Migrations never import application code: they must run the same forever.',
      shared: 'shared/ is pure code used by client and server: it imports nothing outside shared/.',
      client: 'The client never imports server code: share it through shared/.',
      app: 'Nothing below the app imports the app: what features need comes in AppDeps (lib/deps).',
      below: 'server/lib and server/middleware sit below the features: they never import one.',
      serverFeature:
        "Another server feature is reached only through its index.ts (import '@server/features/<feature>').",
      clientApp:
        'Features and the UI kit sit below the app: they never import a page or the router.',
      kit: 'components/ui is used by every feature and imports none.',
      clientBase:
        'src/lib, src/components and src/config sit below the features: they never import a feature or the app.',
      clientFeature:
        "A feature uses another feature's api/ calls only; its components and lib are its own (move what both need to components/ui or lib).",
      alias:
        "Leaving the feature's folder goes by path alias ('@/…', '@shared/…', '@server/…', '@db/…'), not '../'.",
    },
  },
  create(context) {
    const file = path.relative(root, context.filename).split(path.sep).join('/');
    const areas = ['src/', 'server/', 'shared/', 'db/'];
    if (!areas.some((a) => file.startsWith(a))) return {};
    const check = (source) => {
      const spec = source && typeof source.value === 'string' ? source.value : null;
      if (!spec) return;
      const target = resolveImport(file, spec);
      if (!target) return;
      const broken = wallBroken(file, target);
      if (broken) context.report({ node: source, messageId: broken });
      else if (climbsOut(file, spec, target)) context.report({ node: source, messageId: 'alias' });
    };
    return {
      ImportDeclaration: (node) => check(node.source),
      ExportNamedDeclaration: (node) => check(node.source),
      ExportAllDeclaration: (node) => check(node.source),
      ImportExpression: (node) => check(node.source),
    };
  },
};

export const house = { rules: { walls } };
