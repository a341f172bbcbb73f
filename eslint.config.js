import tseslint from 'typescript-eslint';
import importX from 'eslint-plugin-import-x';

const boundary = (from, forbidden, message) => ({
  files: [`${from}/**/*.{ts,tsx}`],
  rules: {
    'no-restricted-imports': ['error', { patterns: forbidden.map((group) => ({ group, message })) }],
  },
});

export default tseslint.config(
  { ignores: ['node_modules/**', 'dist/**', '.data/**', 'coverage/**'] },
  ...tseslint.configs.recommended,
  {
    plugins: { 'import-x': importX },
    settings: { 'import-x/resolver': { typescript: { project: './tsconfig.json' }, node: true } },
    rules: {
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-explicit-any': 'error',
    },
  },
  // shared/ is used by both sides and never imports from them; domain code has no I/O.
  boundary('shared', ['@backend/*', '@frontend/*', '**/backend/**', '**/frontend/**'], 'shared/ must not import from backend/ or frontend/'),
  {
    files: ['shared/domain/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        paths: ['fs', 'node:fs', 'http', 'node:http', 'typeorm', 'express', 'mysql2'].map((name) => ({ name, message: 'shared/domain is pure: no I/O' })),
        patterns: [{ group: ['@backend/*', '@frontend/*', '**/backend/**', '**/frontend/**'], message: 'shared/ must not import from backend/ or frontend/' }],
      }],
    },
  },
  boundary('frontend/src', ['@backend/*', '**/backend/**'], 'the browser bundle must not import server code'),
  boundary('backend/src', ['@frontend/*', '**/frontend/**'], 'the server must not import browser code'),
);
