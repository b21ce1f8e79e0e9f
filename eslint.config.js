// Lint rules that enforce the project's layering (see DEVELOPERS.md → "Guardrails"):
// shared/ stays pure, only src/api talks to the network, the client never reaches into the server,
// and server services never depend on middleware. Formatting is Prettier's job (eslint-config-prettier).
import js from '@eslint/js';
import prettier from 'eslint-config-prettier';
import vue from 'eslint-plugin-vue';
import globals from 'globals';
import tseslint from 'typescript-eslint';

// Bare builtin names are exact paths: as gitignore-style patterns they would also match './http'.
const nodeBuiltinPaths = [
  'fs',
  'path',
  'os',
  'crypto',
  'child_process',
  'http',
  'https',
  'net',
  'url',
  'util',
  'zlib',
  'stream',
  'worker_threads',
];
const nodeBuiltins = ['node:*', 'fs/*'];
const serverPackages = [
  'express',
  'express/*',
  'drizzle-orm',
  'drizzle-orm/*',
  'pg',
  '@electric-sql/*',
  'argon2',
  'nodemailer',
  'smtp-server',
  'cookie-parser',
  'helmet',
  'pino',
  'pino-http',
  'piscina',
  'multer',
];
const clientPackages = ['vue', 'vue-router', 'pinia', 'naive-ui', '@vueuse/*', '@/*'];

export default tseslint.config(
  {
    ignores: [
      'dist/**',
      'node_modules/**',
      'coverage/**',
      'shared/chemistry/generated/**',
      'drizzle/**',
      'data/**',
      'tests/e2e/screenshots/**',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...vue.configs['flat/recommended'],
  {
    files: ['**/*.vue'],
    languageOptions: {
      parserOptions: { parser: tseslint.parser, extraFileExtensions: ['.vue'], sourceType: 'module' },
    },
  },
  {
    languageOptions: { ecmaVersion: 2023, sourceType: 'module' },
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrorsIgnorePattern: '^_' },
      ],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports' }],
      'no-console': 'off',
      eqeqeq: ['error', 'always'],
      'vue/multi-word-component-names': 'off',
      // v-html only ever renders formatFormula/formatEquation output, which escapes all text it did not build.
      'vue/no-v-html': 'off',
    },
  },
  // shared/: pure code that runs in the browser and on the server alike.
  {
    files: ['shared/**/*.ts'],
    languageOptions: { globals: { ...globals.es2023 } },
    rules: {
      'no-restricted-imports': [
        'error',
        {
          paths: nodeBuiltinPaths.map((name) => ({
            name,
            message: 'shared/ runs in the browser too: no Node modules.',
          })),
          patterns: [
            { group: nodeBuiltins, message: 'shared/ runs in the browser too: no Node modules.' },
            { group: serverPackages, message: 'shared/ must not depend on server packages.' },
            { group: clientPackages, message: 'shared/ must not depend on the client.' },
            { group: ['**/server/**', '**/src/**'], message: 'shared/ imports only from shared/.' },
          ],
        },
      ],
      'no-restricted-globals': [
        'error',
        ...[
          'window',
          'document',
          'navigator',
          'localStorage',
          'sessionStorage',
          'fetch',
          'process',
          'Buffer',
          'require',
          '__dirname',
          'setImmediate',
        ].map((name) => ({
          name,
          message: `shared/ must not use ${name}: it runs in the browser and on the server alike.`,
        })),
      ],
    },
  },
  // src/: the Vue client.
  {
    files: ['src/**/*.ts', 'src/**/*.vue'],
    languageOptions: { globals: { ...globals.browser } },
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['**/server/**', '@server/*'],
              message: 'The client must not import server code; share it through shared/.',
            },
            { group: nodeBuiltins, message: 'The client runs in the browser: no Node modules.' },
            { group: serverPackages, message: 'The client must not depend on server packages.' },
          ],
        },
      ],
    },
  },
  // Only src/api/http.ts talks to the network; browser storage goes through @vueuse/core, which
  // survives storage being unavailable (private mode) and keeps tabs in step.
  {
    files: ['src/**/*.ts', 'src/**/*.vue'],
    ignores: ['src/api/**'],
    rules: {
      'no-restricted-globals': [
        'error',
        { name: 'fetch', message: 'Call the server through src/api (http.ts is the only fetch caller).' },
        ...['localStorage', 'sessionStorage'].map((name) => ({
          name,
          message: `Use useLocalStorage / useSessionStorage from @vueuse/core instead of ${name}.`,
        })),
      ],
      'no-restricted-properties': [
        'error',
        { object: 'window', property: 'fetch', message: 'Call the server through src/api.' },
        { object: 'globalThis', property: 'fetch', message: 'Call the server through src/api.' },
        ...['window', 'globalThis'].flatMap((object) =>
          ['localStorage', 'sessionStorage'].map((property) => ({
            object,
            property,
            message: 'Use useLocalStorage / useSessionStorage from @vueuse/core.',
          })),
        ),
      ],
    },
  },
  // naive-ui's NCard title (and header slot) renders role="heading" without aria-level: axe fails it.
  {
    files: ['src/**/*.vue'],
    rules: {
      'vue/no-restricted-static-attribute': [
        'error',
        { key: 'title', element: 'NCard', message: 'Use SectionCard: NCard titles are headings without a level.' },
      ],
      'vue/no-restricted-v-bind': [
        'error',
        { argument: 'title', element: 'NCard', message: 'Use SectionCard: NCard titles are headings without a level.' },
      ],
      'vue/no-restricted-syntax': [
        'error',
        {
          selector:
            "VElement[rawName='NCard'] > VElement[name='template'] > VStartTag > VAttribute[directive=true][key.argument.name='header']",
          message: 'Use SectionCard: the NCard header slot renders headings without a level.',
        },
      ],
    },
  },
  // server/, scripts, configs: Node.
  {
    files: ['server/**/*.ts', 'scripts/**/*.{ts,mjs,js}', 'seeds/**/*.ts', '*.config.{ts,js}'],
    languageOptions: { globals: { ...globals.node } },
  },
  {
    files: ['server/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['**/src/**', '@/*'],
              message: 'The server must not import client code; share it through shared/.',
            },
          ],
        },
      ],
    },
  },
  // Services hold the use cases; they must not reach back up into the HTTP layer.
  {
    files: ['server/services/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['**/middleware/**', '**/routes/**'],
              message: 'Services must not import middleware or routes: layers point one way.',
            },
            { group: ['**/src/**', '@/*'], message: 'The server must not import client code.' },
          ],
        },
      ],
    },
  },
  {
    files: ['tests/**/*.ts'],
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: { '@typescript-eslint/no-non-null-assertion': 'off' },
  },
  prettier,
);
