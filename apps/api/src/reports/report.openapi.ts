import { idParams, routesOf } from '../openapi/registry';
import { fileBody } from '../openapi/shapes';

/** /api/sweeps/:id/report and /api/lots/:id/report.pdf */
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
  routesOf('Reports')({
    method: 'get',
    path: '/lots/:id/report.pdf',
    summary: "The printable PDF report of one lot: each wafer's 23 °C value, statistics, fits",
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
