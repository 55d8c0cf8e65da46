// Lint rules for the whole tree: typescript-eslint's recommended set, React's hooks rules for the client.
import js from '@eslint/js';
import globals from 'globals';
import reactHooks from 'eslint-plugin-react-hooks';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['dist/', 'node_modules/', 'uploads/', '.data/', 'coverage/'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { ecmaVersion: 2023, sourceType: 'module', globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
    },
  },
  // Declarations of untyped packages name classes only as types.
  { files: ['**/*.d.ts'], rules: { '@typescript-eslint/no-unused-vars': 'off' } },
  // One data-access style on the server: SQL lives in the named query modules of server/queries/ (one per table),
  // which services compose. Exempt: the query modules themselves; db.ts (the connection, its readiness ping);
  // migrate.ts and migrations/ (umzug runs their SQL); mail/catcher.ts (the mail catcher runs as its own process
  // with a bare pg pool, apart from the app's Sequelize). Tests and benchmarks are outside: they check and set up
  // stored state independently of the code they measure.
  {
    files: ['server/**/*.ts', 'scripts/seed/**/*.ts'],
    ignores: ['server/queries/**', 'server/db.ts', 'server/migrate.ts', 'server/migrations/**', 'server/mail/catcher.ts'],
    rules: {
      'no-restricted-syntax': [
        'error',
        {
          selector: "CallExpression[callee.type='MemberExpression'][callee.property.name='query']",
          message: 'SQL goes in a named function of server/queries/<table>.ts; call that function here.',
        },
      ],
      'no-restricted-imports': [
        'error',
        {
          paths: [
            {
              name: 'sequelize',
              importNames: ['QueryTypes', 'Model', 'DataTypes', 'Op'],
              message:
                'Models and query building are not used: write the SQL in server/queries/<table>.ts (Sequelize is the connection and transactions only).',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks },
    rules: { 'react-hooks/rules-of-hooks': 'error', 'react-hooks/exhaustive-deps': 'error' },
  },
);
