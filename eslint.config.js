import { existsSync, readdirSync } from 'node:fs';
import tseslint from 'typescript-eslint';
import importX from 'eslint-plugin-import-x';
import jsxA11y from 'eslint-plugin-jsx-a11y';
import reactHooks from 'eslint-plugin-react-hooks';

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

// One way through the front end: app → features → components and lib.
const oneWayZones = [
  { target: './frontend/src/features', from: './frontend/src/app', message: 'features never import the app: the app composes features' },
  {
    target: './frontend/src/components',
    from: ['./frontend/src/app', './frontend/src/features'],
    message: 'components/ are shared pieces: they import only lib/ and each other',
  },
  { target: './frontend/src/lib', from: ['./frontend/src/app', './frontend/src/features', './frontend/src/components'], message: 'lib/ is the bottom layer' },
];

export default tseslint.config(
  { ignores: ['node_modules/**', '**/dist/**', '.data/**', 'coverage/**'] },
  ...tseslint.configs.recommended,
  {
    plugins: { 'import-x': importX },
    settings: { 'import-x/resolver': { typescript: { project: './tsconfig.json' }, node: true } },
    rules: {
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
      'import-x/no-restricted-paths': ['error', { zones: [...featureZones, ...oneWayZones] }],
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
          patterns: [
            { group: ['@backend/*', '@frontend/*', '**/backend/**', '**/frontend/**'], message: 'shared/ must not import from backend/ or frontend/' },
          ],
        },
      ],
    },
  },
  // React: the rules of hooks and accessible markup.
  { files: ['frontend/src/**/*.{ts,tsx}'], ...reactHooks.configs.flat['recommended-latest'] },
  { files: ['frontend/src/**/*.tsx'], ...jsxA11y.flatConfigs.recommended },
  {
    files: ['frontend/src/**/*.tsx'],
    rules: {
      // Focus moves only into a form the person has just opened (a rename, a new organisation): our own components.
      'jsx-a11y/no-autofocus': ['error', { ignoreNonDOM: true }],
      // Escape closes an open form or confirmation: a keyboard handler on the form or group itself, not a fake button.
      'jsx-a11y/no-noninteractive-element-interactions': [
        'error',
        { handlers: ['onClick', 'onMouseDown', 'onMouseUp', 'onKeyPress', 'onKeyDown', 'onKeyUp'], form: ['onKeyDown'], group: ['onKeyDown'] },
      ],
      // Checkbox labels carry their text and a note in nested spans.
      'jsx-a11y/label-has-associated-control': ['error', { depth: 3 }],
    },
  },
  boundary('frontend/src', ['@backend/*', '**/backend/**'], 'the browser bundle must not import server code'),
  boundary('backend/src', ['@frontend/*', '**/frontend/**'], 'the server must not import browser code'),
);
