import { z } from 'zod';
import { routesOf } from '../openapi/registry';
import { dateTime, fileBody, itemsOf } from '../openapi/shapes';
import type { DevMailItem } from './dev-mail.service';

const mailItem = z
  .object({
    file: z.string(),
    sizeBytes: z.number().int(),
    receivedAt: dateTime,
    to: z.string(),
    subject: z.string(),
  })
  .strict() satisfies z.ZodType<DevMailItem>;

/** /api/dev/mail: mounted only outside production. */
export function registerDevMailApi(): void {
  const route = routesOf('Development', 'none');
  route({
    method: 'get',
    path: '/dev/mail',
    summary: 'E-mail the local SMTP stand-in captured (never in production)',
    description: 'A browser asking for HTML gets a small page instead.',
    ok: { status: 200, description: 'The newest messages', schema: itemsOf(mailItem) },
  });
  route({
    method: 'get',
    path: '/dev/mail/:file',
    summary: 'One captured message as it was sent (never in production)',
    params: z.object({ file: z.string() }),
    ok: {
      status: 200,
      description: 'The raw message',
      schema: fileBody,
      contentType: 'text/plain',
    },
    errors: [404],
  });
}
