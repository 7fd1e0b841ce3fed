import { describe, expect, it } from 'vitest';
import { openApiDocument } from './document';

type Operation = { responses: Record<string, { description: string }> };

function operation(path: string, method: string): Operation | undefined {
  const paths = openApiDocument().paths as Record<string, Record<string, Operation>>;
  return paths[path]?.[method];
}

const statuses = (op: Operation | undefined) => Object.keys(op?.responses ?? {});

describe('registerCrud', () => {
  it('gives each usual route its answer and errors, and the user token errors', () => {
    expect(statuses(operation('/lots', 'get'))).toEqual(['200', '400', '401', '503']);
    expect(operation('/lots', 'post')?.responses['201']?.description).toBe('The new lot');
    expect(statuses(operation('/lots/{id}', 'get'))).toEqual(['200', '400', '401', '404', '503']);
    const removed = ['204', '400', '401', '403', '404', '409', '503'];
    expect(statuses(operation('/stations/{id}', 'delete'))).toEqual(removed);
    expect(operation('/stations/{id}', 'patch')?.responses['200']?.description).toBe(
      'The changed station',
    );
  });

  it('registers only the routes a resource names, with errors it replaces', () => {
    expect(operation('/users/{id}', 'delete')).toBeUndefined();
    expect(operation('/wafers', 'post')).toBeUndefined();
    expect(statuses(operation('/users/{id}', 'get'))).toContain('403');
    expect(statuses(operation('/assignments', 'post'))).toContain('404');
  });
});
