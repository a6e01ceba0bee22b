import { z } from 'zod';

export const readOneSchema = z.object({ id: z.uuid('That notification does not exist.') });
