import { existsSync, readdirSync } from 'node:fs';
import tseslint from 'typescript-eslint';
import importX from 'eslint-plugin-import-x';

const boundary = (from, forbidden, message) => ({
  files: [`${from}/**/*.{ts,tsx}`],
  rules: { 'no-restricted-imports': ['error', { patterns: [{ group: forbidden, message }] }] },
});

// Front-end features do not import each other: shared pieces go to components/ or lib/.
const featuresDir = 'frontend/src/features';
const features = existsSync(featuresDir) ? readdirSync(featuresDir) : [];
const featureZones = features.map((f) => ({
  target: `./${featuresDir}/${f}`,
  from: `./${featuresDir}`,
  except: [`./${f}`],
  message: 'features do not import each other; move shared code to components/ or lib/',
}));

export default tseslint.config(
  { ignores: ['node_modules/**', '**/dist/**', '.data/**', 'coverage/**'] },
  ...tseslint.configs.recommended,
  {
    plugins: { 'import-x': importX },
    settings: { 'import-x/resolver': { typescript: { project: './tsconfig.json' }, node: true } },
    rules: {
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
      'import-x/no-restricted-paths': ['error', { zones: featureZones }],
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-explicit-any': 'error',
    },
  },
  // shared/ is used by both sides and never imports from them.
  boundary('shared', ['@backend/*', '@frontend/*', '**/backend/**', '**/frontend/**'], 'shared/ must not import from backend/ or frontend/'),
  // shared/domain is pure calculation: no I/O, no ORM, no server.
  {
    files: ['shared/domain/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          paths: ['fs', 'node:fs', 'http', 'node:http', 'child_process', 'node:child_process', 'typeorm', 'express', 'mysql2'].map((name) => ({
            name,
            message: 'shared/domain is pure: no I/O',
          })),
          patterns: [{ group: ['@backend/*', '@frontend/*', '**/backend/**', '**/frontend/**'], message: 'shared/ must not import from backend/ or frontend/' }],
        },
      ],
    },
  },
  boundary('frontend/src', ['@backend/*', '**/backend/**'], 'the browser bundle must not import server code'),
  boundary('backend/src', ['@frontend/*', '**/frontend/**'], 'the server must not import browser code'),
);
