import pluginVue from 'eslint-plugin-vue'
import { defineConfigWithVueTs, vueTsConfigs } from '@vue/eslint-config-typescript'

// Layers point one way: src -> shared <- server. shared/ stays pure so the engine runs
// unchanged in the browser, the server and the CLI.
export default defineConfigWithVueTs(
  { ignores: ['dist/**', 'node_modules/**', '.data/**', 'tests/artifacts/**'] },
  pluginVue.configs['flat/essential'],
  vueTsConfigs.recommended,
  {
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['node:*', 'fs', 'path', 'http', 'crypto'], message: 'shared/ has no I/O' },
            { group: ['vue', 'quasar', 'pinia', 'vue-router', 'ol', 'ol/*'], message: 'shared/ is framework-free' },
            { group: ['express', 'sequelize', 'mariadb', 'passport*'], message: 'shared/ is server-free' },
            { group: ['**/src/**', '**/server/**'], message: 'shared/ never imports src/ or server/' },
          ],
        },
      ],
    },
  },
  {
    files: ['src/**/*.{ts,vue}'],
    rules: {
      'no-restricted-imports': [
        'error',
        { patterns: [{ group: ['**/server/**'], message: 'the client talks to the server over HTTP only' }] },
      ],
    },
  },
  {
    files: ['server/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        { patterns: [{ group: ['**/src/**'], message: 'the server never imports client code' }] },
      ],
    },
  },
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-non-null-assertion': 'off',
    },
  },
)
