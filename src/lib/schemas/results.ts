import { z } from 'zod';
import { GROUP_SPLITS, type GroupSplit } from '../results/item-analysis';

/** ?groups=halves (the default) or ?groups=27: how the step analysis picks its upper and lower groups. */
export const resultsQuerySchema = z.object({
  groups: z
    .enum(Object.keys(GROUP_SPLITS) as [GroupSplit, ...GroupSplit[]], {
      errorMap: () => ({ message: 'groups is "halves" or "27" (top and bottom 27 %)' }),
    })
    .default('halves'),
});

export function resultsQuery(url: URL) {
  return resultsQuerySchema.safeParse(Object.fromEntries(url.searchParams));
}
