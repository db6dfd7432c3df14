import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import path from 'node:path';

const root = import.meta.dirname;

/**
 * The client's walls between features, on resolved paths (a specifier alone cannot say whose
 * file it reaches): a feature (src/features/<f>/) uses another feature only through its api/
 * calls, never its components or lib, and never the app above it; the shared UI kit
 * (src/components/ui/) imports no feature and no page.
 */
const house = {
  rules: {
    'client-layers': {
      meta: {
        type: 'problem',
        schema: [],
        messages: {
          otherFeature:
            "A feature uses another feature's api/ calls only; its components and lib are its own (move what both need to components/ui or lib).",
          app: 'Features and the UI kit sit below the app: they never import a page or the router.',
          kit: 'components/ui is used by every feature and imports none.',
        },
      },
      create(context) {
        const file = path.relative(root, context.filename).split(path.sep).join('/');
        const own = /^src\/features\/([^/]+)\//.exec(file)?.[1];
        const kit = file.startsWith('src/components/ui/');
        if (!own && !kit) return {};
        const check = (source) => {
          const spec = source && typeof source.value === 'string' ? source.value : null;
          if (!spec || !spec.startsWith('.')) return;
          const target = path.posix.normalize(path.posix.join(path.posix.dirname(file), spec));
          const feature = /^src\/features\/([^/]+)(?:\/(.*))?$/.exec(target);
          if (target.startsWith('src/app/')) context.report({ node: source, messageId: 'app' });
          else if (kit && feature) context.report({ node: source, messageId: 'kit' });
          else if (own && feature && feature[1] !== own && !(feature[2] ?? '').startsWith('api/'))
            context.report({ node: source, messageId: 'otherFeature' });
        };
        return {
          ImportDeclaration: (node) => check(node.source),
          ExportNamedDeclaration: (node) => check(node.source),
          ExportAllDeclaration: (node) => check(node.source),
          ImportExpression: (node) => check(node.source),
        };
      },
    },
  },
};

// Rules are errors or off, never warnings: a warning nobody fixes is noise.
export default tseslint.config(
  { ignores: ['dist', 'node_modules', '.data', 'test-results', 'playwright-report'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', destructuredArrayIgnorePattern: '^_' },
      ],
      '@typescript-eslint/no-non-null-assertion': 'off',
      '@typescript-eslint/no-explicit-any': 'error',
    },
  },
  // The house's walls (DEVELOPERS.md): imports go app → features → lib → shared, one way.
  {
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          paths: ['express', 'knex', 'pg', 'react', 'react-dom'].map((name) => ({
            name,
            message:
              'shared/ is pure code used by client and server: no server or browser libraries.',
          })),
          patterns: [
            {
              regex: '^(\\.\\./)+(server|src|db|tests|e2e|scripts)(/|$)',
              message: 'shared/ imports nothing outside shared/.',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          paths: ['express', 'knex', 'pg'].map((name) => ({
            name,
            message: 'The client never uses server libraries.',
          })),
          patterns: [
            {
              regex: '^(\\.\\./)+(server|db)(/|$)',
              message: 'The client never imports server code: share it through shared/.',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['server/lib/**/*.ts', 'server/middleware/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^(\\.\\./)+features(/|$)',
              message: 'lib/ and middleware/ sit below the features: they never import one.',
            },
            {
              regex: '^(\\.\\./)+(app|routes)$',
              message: 'Nothing below the app imports the app.',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['server/features/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^\\.\\./[a-z-]+/',
              message:
                "Another feature is reached only through its index.ts (import from '../<feature>').",
            },
            {
              regex: '^(\\.\\./)+(app|routes)$',
              message: 'Features never import the app; what they need comes in AppDeps (lib/deps).',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['db/migrations/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^(\\.\\./)+(server|src|shared)(/|$)',
              message: 'Migrations never import application code: they must run the same forever.',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { house },
    rules: { 'house/client-layers': 'error' },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
    },
  },
);
