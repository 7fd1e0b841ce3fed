import { idParams, routesOf } from '../openapi/registry';
import { fileBody } from '../openapi/shapes';

/** /api/sweeps/:id/report */
export function registerReportsApi(): void {
  routesOf('Reports')({
    method: 'get',
    path: '/sweeps/:id/report',
    summary: 'The printable PDF report of one sweep',
    params: idParams,
    ok: {
      status: 200,
      description: 'The report',
      schema: fileBody,
      contentType: 'application/pdf',
    },
    errors: [404],
  });
}
