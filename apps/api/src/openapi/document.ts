/**
 * The OpenAPI 3.1 document of the API, built once from what each resource registered. A new
 * resource adds its `register…Api` to `RESOURCES`; a new route of an existing resource is one
 * `registerRoute` call in that resource's `.openapi.ts`.
 */
import { OpenApiGeneratorV31 } from '@asteasolutions/zod-to-openapi';
import { registerActivityApi } from '../activity/activity.openapi';
import { registerAnalysisApi } from '../analysis/analysis.openapi';
import { registerAssignmentsApi } from '../assignments/assignments.openapi';
import { registerAuditApi } from '../audit/audit.openapi';
import { registerAuthApi } from '../auth/auth.openapi';
import { registerFitsApi } from '../fits/fit.openapi';
import { registerHealthApi } from '../health/health.openapi';
import { registerImportSettingsApi } from '../import-settings/import-settings.openapi';
import { registerLotsApi } from '../lots/lots.openapi';
import { registerMapsApi } from '../maps/maps.openapi';
import { registerPlannerApi } from '../planner/planner.openapi';
import { registerDevMailApi } from '../mail/dev-mail.openapi';
import { registerReportsApi } from '../reports/report.openapi';
import { registerStationPostApi } from '../station-posts/station-post.openapi';
import { registerStationTokensApi } from '../station-tokens/station-tokens.openapi';
import { registerStationsApi } from '../stations/stations.openapi';
import { registerSearchApi } from '../search/search.openapi';
import { registerSweepsApi } from '../sweeps/sweep.openapi';
import { registerUsersApi } from '../users/users.openapi';
import { registerWafersApi } from '../wafers/wafers.openapi';
import { registerOpenApiApi } from './openapi.openapi';
import { registry } from './registry';

/** One function per resource, each registering that resource's routes (one line each). */
const RESOURCES: ReadonlyArray<() => void> = [
  registerHealthApi,
  registerOpenApiApi,
  registerAuthApi,
  registerUsersApi,
  registerLotsApi,
  registerWafersApi,
  registerStationsApi,
  registerStationTokensApi,
  registerStationPostApi,
  registerAssignmentsApi,
  registerAuditApi,
  registerActivityApi,
  registerSweepsApi,
  registerImportSettingsApi,
  registerAnalysisApi,
  registerFitsApi,
  registerReportsApi,
  registerDevMailApi,
  registerPlannerApi,
  registerSearchApi,
  registerMapsApi,
];

/** The generated document (OpenAPI 3.1). */
export type OpenApiDocument = ReturnType<OpenApiGeneratorV31['generateDocument']>;

let built: OpenApiDocument | undefined;

/** The document `GET /api/openapi.json` serves (paths relative to the server URL `/api`). */
export function openApiDocument(): OpenApiDocument {
  if (built) return built;
  for (const register of RESOURCES) register();
  const generated = new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Rhotrace API',
      version: '1',
      description:
        'The lab notebook for wafer resistivity against temperature. Errors answer ' +
        '`{ error: { code, message, details? } }`. Station computers post sweeps with a station ' +
        'token (see docs/station-client.md).',
    },
    servers: [{ url: '/api' }],
  });
  built = repaired(JSON.parse(JSON.stringify(generated))) as OpenApiDocument;
  return built;
}

/**
 * Two repairs of zod-to-openapi's 3.1 output. It writes `z.enum([...]).nullable()` as
 * `type: [string, null]` with an enum that lacks null, so a real null answer would fail: null
 * joins such enums. It writes a tuple as `prefixItems` alone, which allows any further items:
 * the tuple's length becomes its minItems and maxItems.
 */
function repaired(node: unknown): unknown {
  if (Array.isArray(node)) return node.map(repaired);
  if (node === null || typeof node !== 'object') return node;
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(node)) out[key] = repaired(value);
  const { type, enum: values, prefixItems } = out;
  if (Array.isArray(type) && type.includes('null') && Array.isArray(values)) {
    if (!values.includes(null)) out.enum = [...values, null];
  }
  if (Array.isArray(prefixItems) && out.items === undefined) {
    out.minItems = prefixItems.length;
    out.maxItems = prefixItems.length;
  }
  return out;
}
