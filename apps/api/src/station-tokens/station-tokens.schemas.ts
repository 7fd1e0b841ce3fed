import { z } from 'zod';
import { requiredText } from '../middleware/fields';
import { idParam } from '../middleware/validate';

/** `POST /api/stations/:id/tokens` body. */
export const createTokenBody = z.object({ label: requiredText(100) }).strict();

/** `/api/stations/:id/tokens/:tokenId` path. */
export const tokenParams = z.object({ id: idParam, tokenId: idParam });
