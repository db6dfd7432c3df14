import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';

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
            {
              regex: '^\\.\\./\\.\\./[a-z-]+/(components|lib|hooks)/',
              message:
                "A feature uses another feature's api/ calls only; its components and lib are its own (move shared pieces to components/ui or lib).",
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
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
    },
  },
);
