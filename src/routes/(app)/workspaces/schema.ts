import { z } from 'zod';
import { workspaceName } from '$lib/schemas/names';

export const createWorkspaceSchema = z.object({ name: workspaceName });
