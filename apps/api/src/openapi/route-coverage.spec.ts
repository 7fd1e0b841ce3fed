import type { ILayer } from 'express-serve-static-core';
import { describe, expect, it } from 'vitest';
import { loadConfig } from '../config';
import { apiRoutes } from '../routes';
import type { AppDeps } from '../deps';
import { openApiDocument } from './document';
import { openApiPath } from './registry';

/** Every `METHOD /path` Express mounts under /api, read from the routers' own stacks. */
function mountedRoutes(stack: readonly ILayer[]): string[] {
  return stack.flatMap((layer): string[] => {
    if (layer.route) {
      const path = openApiPath(layer.route.path);
      const methods = new Set(layer.route.stack.map((handler) => handler.method.toUpperCase()));
      return [...methods].map((method) => `${method} ${path}`);
    }
    const inner = 'stack' in layer.handle ? layer.handle.stack : undefined;
    return Array.isArray(inner) ? mountedRoutes(inner as ILayer[]) : [];
  });
}

function documentedRoutes(): string[] {
  const paths = openApiDocument().paths as Record<string, Record<string, unknown>>;
  return Object.entries(paths).flatMap(([path, ops]) =>
    Object.keys(ops).map((m) => `${m.toUpperCase()} ${path}`),
  );
}

describe('the OpenAPI document', () => {
  // routers only read the config while being built; no database is opened
  const deps = { config: loadConfig({ ...process.env, NODE_ENV: 'development' }) } as AppDeps;
  const mounted = mountedRoutes(apiRoutes(deps).stack);

  it('describes every route Express mounts under /api, and no other', () => {
    expect(mounted.length).toBeGreaterThan(50);
    expect(mounted.filter((r) => !documentedRoutes().includes(r))).toEqual([]);
    expect(documentedRoutes().filter((r) => !mounted.includes(r))).toEqual([]);
  });

  it('names a security scheme for every route but the public ones', () => {
    const PUBLIC = [
      'GET /health',
      'GET /openapi.json',
      'POST /auth/login',
      'POST /auth/password-reset',
      'POST /auth/password-reset/confirm',
      'GET /dev/mail',
      'GET /dev/mail/{file}',
    ];
    const paths = openApiDocument().paths as Record<string, Record<string, { security?: [] }>>;
    const open = Object.entries(paths).flatMap(([path, ops]) =>
      Object.entries(ops)
        .filter(([, op]) => !op.security?.length)
        .map(([m]) => `${m.toUpperCase()} ${path}`),
    );
    expect(open.sort()).toEqual([...PUBLIC].sort());
  });
});
