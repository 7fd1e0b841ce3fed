/**
 * Checks real answers against the OpenAPI document with an independent validator (ajv, JSON
 * Schema 2020-12 as OpenAPI 3.1 uses), so the document cannot drift from the code.
 */
import { Ajv2020, type ValidateFunction } from 'ajv/dist/2020.js';
import addFormats from 'ajv-formats';
import { openApiDocument } from '../document';

type Schema = Record<string, unknown>;

/** '#/components/schemas/X' → 'components#/$defs/X', so every ref resolves in one schema. */
function rebased(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(rebased);
  if (value === null || typeof value !== 'object') return value;
  return Object.fromEntries(
    Object.entries(value).map(([k, v]) => [
      k,
      k === '$ref' && typeof v === 'string'
        ? v.replace('#/components/schemas/', 'components#/$defs/')
        : rebased(v),
    ]),
  );
}

let ajv: Ajv2020 | undefined;
const compiled = new Map<string, ValidateFunction>();

function validatorFor(method: string, path: string, status: number): ValidateFunction {
  const key = `${method} ${path} ${status}`;
  const known = compiled.get(key);
  if (known) return known;
  const doc = openApiDocument();
  if (!ajv) {
    ajv = new Ajv2020({ strict: true, allErrors: true });
    addFormats.default(ajv);
    ajv.addSchema({ $id: 'components', $defs: rebased(doc.components?.schemas ?? {}) });
  }
  const item = doc.paths?.[path];
  const operations = {
    GET: item?.get,
    POST: item?.post,
    PATCH: item?.patch,
    PUT: item?.put,
    DELETE: item?.delete,
  };
  const operation = operations[method as keyof typeof operations];
  if (!operation) throw new Error(`${method} ${path} is not in the OpenAPI document`);
  const response = operation.responses?.[String(status)];
  const schema =
    response && 'content' in response ? response.content?.['application/json']?.schema : undefined;
  if (!schema) throw new Error(`${key}: the document gives no JSON answer for this status`);
  const validate = ajv.compile(rebased(schema) as Schema);
  compiled.set(key, validate);
  return validate;
}

/**
 * The problems of `body` against the document's schema for `method path` answering `status`
 * (`path` as the document writes it, `/lots/{id}`); an empty list when it matches.
 */
export function documentProblems(
  method: string,
  path: string,
  status: number,
  body: unknown,
): string[] {
  const validate = validatorFor(method, path, status);
  if (validate(body)) return [];
  return (validate.errors ?? []).map(
    (e) => `${e.instancePath || '/'} ${e.message ?? ''} ${JSON.stringify(e.params)}`,
  );
}
