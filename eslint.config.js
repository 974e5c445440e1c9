// One lint setup for the whole project: typescript-eslint everywhere, angular-eslint for the
// client, Prettier for formatting (eslint-config-prettier turns off the rules it owns).
const tseslint = require('typescript-eslint');
const angular = require('angular-eslint');
const prettier = require('eslint-config-prettier');

module.exports = tseslint.config(
  {
    ignores: [
      'dist/**',
      '.data/**',
      '.angular/**',
      'node_modules/**',
      'coverage/**',
      '**/*.js',
      '!eslint.config.js',
    ],
  },
  {
    files: ['**/*.ts'],
    extends: [...tseslint.configs.recommended, prettier],
    rules: {
      '@typescript-eslint/no-explicit-any': 'error',
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
      'no-restricted-syntax': [
        'error',
        {
          selector: "CallExpression[callee.object.name='it'][callee.property.name='skip']",
          message: 'No skipped tests.',
        },
        {
          selector: "CallExpression[callee.object.name='test'][callee.property.name='skip']",
          message: 'No skipped tests.',
        },
        {
          selector: "CallExpression[callee.object.name='describe'][callee.property.name='skip']",
          message: 'No skipped tests.',
        },
        { selector: "CallExpression[callee.property.name='only']", message: 'No focused tests.' },
        {
          selector: 'CallExpression[callee.name=/^(fit|fdescribe|xit|xdescribe)$/]',
          message: 'No focused or skipped tests.',
        },
      ],
    },
  },
  {
    files: ['src/**/*.ts'],
    extends: [...angular.configs.tsRecommended],
    processor: angular.processInlineTemplates,
    rules: {
      '@angular-eslint/component-selector': [
        'error',
        { type: 'element', prefix: 'rp', style: 'kebab-case' },
      ],
      '@angular-eslint/directive-selector': [
        'error',
        { type: 'attribute', prefix: 'rp', style: 'camelCase' },
      ],
      '@angular-eslint/prefer-on-push-component-change-detection': 'error',
      'no-restricted-imports': [
        'error',
        {
          paths: [
            {
              name: '@angular/common',
              importNames: ['CommonModule'],
              message: 'Import what you use.',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['src/**/*.html'],
    extends: [...angular.configs.templateRecommended, ...angular.configs.templateAccessibility],
  },
  {
    // collab/ runs in browsers, Web Workers and Node alike: no framework, DOM or Node-only imports.
    files: ['collab/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: [
                '@angular/*',
                'express',
                'express-*',
                'typeorm',
                'pg',
                'socket.io',
                'passport*',
              ],
              message: 'collab/ is framework-free.',
            },
            {
              group: [
                'node:*',
                'fs',
                'path',
                'child_process',
                'os',
                'crypto',
                'http',
                'net',
                'worker_threads',
              ],
              message: 'collab/ must not use Node-only APIs.',
            },
          ],
        },
      ],
      'no-restricted-globals': ['error', 'process', 'Buffer', 'require', 'window', 'document'],
    },
  },
  {
    files: ['src/**/*.ts', 'collab/**/*.ts'],
    rules: { 'no-console': ['error', { allow: ['error', 'warn'] }] },
  },
);
