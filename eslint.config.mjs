// ESLint (flat config): TypeScript rules, the React hooks rules, and the layer rule (each folder imports
// only downward; see DEVELOPERS.md). Run by `npm test` (scripts/test.mjs) and `npm run lint`.
import reactHooks from 'eslint-plugin-react-hooks';
import tseslint from 'typescript-eslint';

const below = (...folders) => folders.map((f) => ({ group: [`**/${f}/**`, `**/${f}`], message: `this layer does not import ${f}/ (layers import downward; see DEVELOPERS.md)` }));

export default tseslint.config(
  { ignores: ['node_modules/**', 'dist/**', 'dist-server/**', '.data/**', 'db/migrations/**', 'tests/.artifacts/**', '.expo/**'] },
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      '@typescript-eslint/no-explicit-any': 'error',
    },
  },
  { files: ['calc/**/*.ts'], rules: { 'no-restricted-imports': ['error', { patterns: below('model', 'drawing', 'canvas', 'components', 'hooks', 'app', 'server', 'db') }] } },
  { files: ['model/**/*.ts'], rules: { 'no-restricted-imports': ['error', { patterns: below('drawing', 'canvas', 'components', 'hooks', 'app', 'server', 'db') }] } },
  { files: ['drawing/**/*.ts'], rules: { 'no-restricted-imports': ['error', { patterns: below('canvas', 'components', 'hooks', 'app', 'server', 'db') }] } },
  { files: ['canvas/**/*.{ts,tsx}'], rules: { 'no-restricted-imports': ['error', { patterns: below('components', 'hooks', 'app', 'server', 'db') }] } },
  { files: ['db/**/*.ts'], rules: { 'no-restricted-imports': ['error', { patterns: below('server', 'canvas', 'drawing', 'components', 'hooks', 'app') }] } },
  // (server/app.ts is the server's own; the Expo routes are never reachable from server/ without canvas/ or components/.)
  { files: ['server/**/*.ts'], rules: { 'no-restricted-imports': ['error', { patterns: below('canvas', 'components', 'hooks') }] } },
  { files: ['hooks/**/*.ts'], rules: { 'no-restricted-imports': ['error', { patterns: below('components', 'app', 'server', 'db') }] } },
  // Tests feed deliberately wrong shapes to the code under test.
  { files: ['tests/**/*.{ts,tsx}'], rules: { '@typescript-eslint/no-explicit-any': 'off' } },
  { files: ['**/*.d.ts'], rules: { '@typescript-eslint/no-unused-vars': 'off', '@typescript-eslint/no-explicit-any': 'off' } },
  { files: ['**/*.{js,cjs,mjs}'], rules: { '@typescript-eslint/no-require-imports': 'off' } },
);
