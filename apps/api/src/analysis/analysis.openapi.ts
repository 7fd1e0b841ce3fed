import { idParams, routesOf } from '../openapi/registry';
import { fileBody } from '../openapi/shapes';
import {
  compareResponse,
  dopantResponse,
  lotSummaryResponse,
  sweepAnalysisResponse,
} from './analysis-responses';
import { materialsResponse, modelCurveResponse } from './model-responses';
import { compareSchema, curveSchema } from './analysis.schemas';

/** Model curves, materials, sweep analysis, dopant density, lot summaries, comparison. */
export function registerAnalysisApi(): void {
  const route = routesOf('Analysis');
  route({
    method: 'post',
    path: '/model/curve',
    summary: 'Resistivity against temperature from the physical model',
    body: curveSchema,
    ok: { status: 200, description: 'The curve', schema: modelCurveResponse },
    errors: [422],
  });
  route({
    method: 'get',
    path: '/materials',
    summary: 'The material catalogue the models use, with sources',
    ok: { status: 200, description: 'The catalogue', schema: materialsResponse },
  });
  route({
    method: 'get',
    path: '/sweeps/:id/analysis',
    summary: 'Steps, Arrhenius coordinates, suggested windows and the 23 °C spec check',
    params: idParams,
    ok: { status: 200, description: 'The analysis', schema: sweepAnalysisResponse },
    errors: [404],
  });
  route({
    method: 'get',
    path: '/wafers/:id/dopant',
    summary: "A wafer's 23 °C resistivity and the dopant density it implies",
    params: idParams,
    ok: { status: 200, description: 'The values and their uncertainty', schema: dopantResponse },
    errors: [404, 422],
  });
  route({
    method: 'get',
    path: '/lots/:id/summary',
    summary: "A lot's wafers against its spec, with capability",
    params: idParams,
    ok: { status: 200, description: 'The summary', schema: lotSummaryResponse },
    errors: [404],
  });
  route({
    method: 'get',
    path: '/lots/:id/summary.csv',
    summary: "A lot's summary as CSV",
    params: idParams,
    ok: { status: 200, description: 'The summary', schema: fileBody, contentType: 'text/csv' },
    errors: [404],
  });
  route({
    method: 'get',
    path: '/compare',
    summary: 'Several sweeps on common temperatures',
    query: compareSchema,
    ok: { status: 200, description: 'The curves', schema: compareResponse },
    errors: [404],
  });
}
