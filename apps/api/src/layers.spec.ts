import { resolve } from 'node:path';
import { ESLint } from 'eslint';
import { beforeAll, describe, expect, it } from 'vitest';

/**
 * The API's layers are enforced by the project's ESLint config, not by a wish: a router or a
 * controller that imports Sequelize or a model, or a service that imports express, fails lint.
 * Each case lints a fixture as if it were a file at the given path.
 */
const REPO = resolve(import.meta.dirname, '../../..');
let eslint: ESLint;

async function restrictedImports(filePath: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: resolve(REPO, filePath) });
  return (result?.messages ?? [])
    .filter((m) => m.ruleId === 'no-restricted-imports')
    .map((m) => m.message);
}

beforeAll(() => {
  eslint = new ESLint({ cwd: REPO });
});

describe('layer boundaries in the API', () => {
  it('refuses Sequelize in a controller', async () => {
    const code = "import { Op } from 'sequelize';\nexport const any = Op.or;\n";
    const problems = await restrictedImports('apps/api/src/x/x.controller.ts', code);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toContain("'sequelize'");
  });

  it('refuses a model in a router', async () => {
    const code = "import { Lot } from '../lots/lot.model';\nexport const model = Lot;\n";
    const problems = await restrictedImports('apps/api/src/x/x.router.ts', code);
    expect(problems).toEqual([expect.stringContaining('never touch a model')]);
  });

  it('refuses express in a service', async () => {
    const code = "import type { Request } from 'express';\nexport type R = Request;\n";
    const problems = await restrictedImports('apps/api/src/x/x.service.ts', code);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toContain("'express'");
  });

  it('lets a service use Sequelize and models, and a controller call a service', async () => {
    const service =
      "import { Op } from 'sequelize';\nimport { Lot } from '../lots/lot.model';\n" +
      'export const parts = [Op.or, Lot];\n';
    expect(await restrictedImports('apps/api/src/x/x.service.ts', service)).toEqual([]);
    const controller =
      "import { listLots } from '../lots/lots.service';\nexport const f = listLots;\n";
    expect(await restrictedImports('apps/api/src/x/x.controller.ts', controller)).toEqual([]);
  });
});
