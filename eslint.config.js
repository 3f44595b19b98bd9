import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import boundaries from 'eslint-plugin-boundaries';

const serverTypes = ['server', 'service', 'command', 'presenter'].map((type) => ({ type }));
const clientTypes = ['client', 'feature', 'component'].map((type) => ({ type }));

/** One lint zone: files of element type `from` may not import any of `to` (eslint-plugin-boundaries). */
function zone(from, to, message) {
  return { from: { element: { type: from } }, disallow: { to: to.map((element) => ({ element })) }, message };
}

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', 'coverage/**', 'tests/.artifacts/**', '.data/**', 'bench-baseline/**', '.tmp/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-explicit-any': 'error',
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'warn',
    },
  },
  {
    // Import boundaries: shared/ is pure; the client never imports the server.
    files: ['shared/**/*.ts'],
    rules: { 'no-restricted-imports': ['error', { patterns: ['**/server/**', '**/src/**', 'node:*', 'express', 'sequelize'] }] },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    rules: { 'no-restricted-imports': ['error', { patterns: ['**/server/**', 'sequelize', 'express'] }] },
  },
  {
    // Layer zones (DEVELOPERS.md, "Layers"): each kind of code knows its room and what it may import.
    files: ['src/**/*.{ts,tsx}', 'server/**/*.ts', 'shared/**/*.ts', 'templates/**/*.ts'],
    plugins: { boundaries },
    settings: {
      'boundaries/include': ['src/**', 'server/**', 'shared/**', 'templates/**'],
      'boundaries/elements': [
        { type: 'feature', pattern: 'src/features/*', capture: ['feature'] },
        { type: 'component', pattern: 'src/components' },
        { type: 'client', pattern: 'src' },
        { type: 'presenter', pattern: 'server/presenters' },
        { type: 'command', pattern: 'server/commands' },
        { type: 'service', pattern: 'server/services' },
        { type: 'server', pattern: 'server' },
        { type: 'template', pattern: 'templates' },
        { type: 'shared', pattern: 'shared' },
      ],
      'import/resolver': { node: { extensions: ['.ts', '.tsx', '.js', '.mjs'] } },
    },
    rules: {
      'boundaries/dependencies': ['error', {
        default: 'allow',
        policies: [
          zone('feature', [{ type: 'feature', captured: { feature: '!{{ from.element.captured.feature }}' } }],
            'A feature never imports another feature: lift the shared part into src/components, src/lib or shared/.'),
          zone('component', [{ type: 'feature' }], 'src/components never imports src/features: pass data in as props or lift the part into src/lib.'),
          zone('template', serverTypes, 'templates/ never import server/: move the pure piece into templates/ or shared/.'),
          zone('presenter', [{ type: 'command' }, { type: 'service' }], 'A presenter shapes an answer only: it never imports commands or services.'),
          zone('shared', [...serverTypes, ...clientTypes, { type: 'template' }], 'shared/ is pure: it imports nothing from server/, src/ or templates/.'),
        ],
      }],
    },
  },
);
