// @ts-check
import js from '@eslint/js';
import angular from 'angular-eslint';
import tseslint from 'typescript-eslint';

/**
 * Package boundaries: libraries import no framework and no other workspace package;
 * the web app never imports the API; nothing reaches into another package by relative path.
 */
const crossPackageRelative = {
  group: [
    '**/libs/**',
    '**/api-types/src/**',
    '**/physics/src/**',
    '**/apps/api/**',
    '**/apps/web/**',
    '../../api/**',
    '../../web/**',
  ],
  message:
    'Import workspace packages by name (@rhotrace/physics, @rhotrace/api-types), never by path.',
};
const frameworks = [
  '@angular/*',
  'rxjs',
  'rxjs/*',
  'express',
  'sequelize',
  'mariadb',
  'multer',
  'nodemailer',
  'pdfkit',
  'plotly.js-dist-min',
];
const restrict = (paths, groups = []) => [
  'error',
  {
    paths: paths.map((name) => ({
      name,
      message: 'This package may not depend on it (package boundaries, README.md).',
    })),
    patterns: [crossPackageRelative, ...groups],
  },
];

/** What nothing in the API imports: the web app and its libraries. */
const apiNeverImports = ['@angular/core', '@angular/common', 'plotly.js-dist-min'];
const apiNeverImportsGroups = [
  { group: ['@angular/*', '@rhotrace/web'], message: 'the API never imports the web app.' },
];

export default tseslint.config(
  {
    ignores: [
      '**/node_modules/**',
      '**/dist/**',
      '**/.angular/**',
      'coverage/**',
      'db/.data/**',
      'bench/out/**',
      'e2e/screenshots/**',
      'seed-data/bad/**',
      'seed-data/sweeps/**',
    ],
  },
  {
    files: ['**/*.ts'],
    extends: [js.configs.recommended, ...tseslint.configs.recommended],
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
      '@typescript-eslint/no-explicit-any': 'error',
      'no-console': 'off',
      'no-restricted-imports': restrict([]),
    },
  },
  {
    files: ['libs/physics/src/**/*.ts'],
    rules: {
      'no-restricted-imports': restrict(
        [...frameworks, 'node:fs', 'node:http', 'node:net', 'fs', 'http'],
        [{ group: ['@rhotrace/*'], message: 'physics imports no other workspace package.' }],
      ),
    },
  },
  {
    files: ['libs/api-types/src/**/*.ts'],
    rules: {
      'no-restricted-imports': restrict(frameworks, [
        { group: ['@rhotrace/*', 'node:*'], message: 'api-types imports nothing but itself.' },
      ]),
    },
  },
  {
    files: ['apps/web/**/*.ts'],
    extends: [...angular.configs.tsRecommended],
    processor: angular.processInlineTemplates,
    rules: {
      'no-restricted-imports': restrict(
        ['express', 'sequelize', 'mariadb', 'multer', 'nodemailer', 'pdfkit'],
        [{ group: ['@rhotrace/api', '@rhotrace/api/*'], message: 'web never imports api.' }],
      ),
      '@angular-eslint/component-selector': [
        'error',
        { type: 'element', prefix: 'rt', style: 'kebab-case' },
      ],
      '@angular-eslint/directive-selector': [
        'error',
        { type: 'attribute', prefix: 'rt', style: 'camelCase' },
      ],
    },
  },
  {
    files: ['apps/web/**/*.html'],
    extends: [...angular.configs.templateRecommended, ...angular.configs.templateAccessibility],
  },
  {
    files: ['apps/api/**/*.ts', 'db/**/*.ts', 'scripts/**/*.ts'],
    rules: {
      'no-restricted-imports': restrict(apiNeverImports, apiNeverImportsGroups),
    },
  },
  {
    // The API's layers (DEVELOPERS.md): routers wire paths and controllers parse and shape; neither
    // touches Sequelize or a model. Services hold the logic and never see express.
    files: ['apps/api/src/**/*.router.ts', 'apps/api/src/**/*.controller.ts'],
    rules: {
      'no-restricted-imports': restrict(
        [...apiNeverImports, 'sequelize', 'mariadb'],
        [
          ...apiNeverImportsGroups,
          {
            group: ['**/*.model', '*.model'],
            message: 'Routers and controllers never touch a model; call the resource service.',
          },
        ],
      ),
    },
  },
  {
    files: ['apps/api/src/**/*.service.ts'],
    rules: {
      'no-restricted-imports': restrict(
        [...apiNeverImports, 'express', 'multer'],
        apiNeverImportsGroups,
      ),
    },
  },
  {
    // Seeders load the demo through the API's own services, as an upload would.
    files: ['db/seeders/**/*.ts'],
    rules: {
      'no-restricted-imports': restrict([], []).map((v, i) =>
        i === 1
          ? { paths: [], patterns: [{ group: ['@angular/*'], message: 'no web code here' }] }
          : v,
      ),
    },
  },
  {
    files: ['**/*.spec.ts', 'e2e/**/*.ts', '**/bench/**/*.ts', '**/testing/**/*.ts'],
    rules: { '@typescript-eslint/no-non-null-assertion': 'off' },
  },
);
