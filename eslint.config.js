import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';

export default tseslint.config(
  { ignores: ['dist', 'dist-server', 'node_modules', '.data', 'coverage', 'test-results', 'playwright-report'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx,js,mjs}'],
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: reactHooks.configs.recommended.rules,
  },
  {
    // Server features meet only through each other's public index.ts (services and types): a file
    // of another feature is its own business and may change under it.
    files: ['server/features/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^\\.\\./(?!\\.\\.)[^/]+/(?!index(\\.js)?$)',
              message:
                "Import another feature through its public index ('../<feature>/index'). If what you need is not there, add a service function (or type) to that feature and export it from its index.ts.",
            },
          ],
        },
      ],
    },
  },
  // Client feature boundaries: another feature (from a feature, the app shell or a shared component) is used only through
  // its public index.ts. A separate block from the server's, so each side's rule reads on its own.
  {
    files: ['src/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              // From a feature: ../../<other>/…; from src/app or src/components: …/features/<feature>/….
              regex: '^(\\.\\./\\.\\./(admin-users|audit|condenser-check|flags|handover|imports|log|logbook|orders|overview|plant|rounds|session|shifts|training|trends)|(\\.\\./)+features/(admin-users|audit|condenser-check|flags|handover|imports|log|logbook|orders|overview|plant|rounds|session|shifts|training|trends))/(?!index$).+',
              message: 'Use the other feature through its public index.ts (import from the feature folder itself).',
            },
          ],
        },
      ],
    },
  },
);
