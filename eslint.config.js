// One lint configuration for every workspace: typed-aware rules stay off so lint is fast;
// the type checker runs separately in `npm run typecheck`.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import prettier from 'eslint-config-prettier';
import globals from 'globals';
import reactHooks from 'eslint-plugin-react-hooks';

export default tseslint.config(
  {
    ignores: ['**/dist/**', '**/node_modules/**', '**/.turbo/**', 'var/**', '**/coverage/**', 'releases/**'],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-explicit-any': 'error',
      '@typescript-eslint/ban-ts-comment': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    files: ['apps/dashboard/src/**', 'packages/widget/src/**'],
    languageOptions: { globals: { ...globals.browser } },
  },
  // Dev pages of the widget run in the browser; its dev checks in Node.
  {
    files: ['packages/widget/dev/**'],
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
  },
  // Hooks rules for the dashboard (React) and the widget (Preact hooks follow the same rules).
  {
    files: ['apps/dashboard/src/**/*.{ts,tsx}', 'packages/widget/src/**/*.{ts,tsx}'],
    ...reactHooks.configs.flat.recommended,
    rules: {
      ...reactHooks.configs.flat.recommended.rules,
      // A missing dependency is a stale value waiting to happen: an error, not a warning.
      'react-hooks/exhaustive-deps': 'error',
    },
  },
  prettier,
);
