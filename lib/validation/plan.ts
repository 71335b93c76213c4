import { z } from 'zod';
import { shootStates } from '@/lib/wizard/types';
import { planTasks } from '@/lib/season/plan';
import { seasonDateSchema } from './season';

export const observationBodySchema = z
  .object({
    date: seasonDateSchema.optional(),
    shoot: z.enum(shootStates).optional(),
    task: z.enum(planTasks).optional(),
  })
  .refine((b) => (b.shoot === undefined) !== (b.task === undefined), { error: 'Give either what you saw (shoot) or the task done (task).', path: ['shoot'] });

export const recordImportSchema = z.object({
  scope: z.enum(['club', 'member'], { error: 'Choose the club record or your own.' }),
  csv: z.string({ error: 'Paste or upload the CSV text.' }).min(1, { error: 'The file is empty.' }).max(3_000_000, { error: 'Keep the file under 3 MB.' }),
});
