import { z } from 'zod';
import { ROSTER_LIMITS } from '../roster/rows';

// Only the shape is checked here; each address is checked by the roster rules (lib/roster) so every
// problem is reported against its own row.

export const invitationsSchema = z.object({
  invites: z
    .array(
      z.object({
        email: z.string({ required_error: 'E-mail is required', invalid_type_error: 'E-mail must be text' }).max(1000, 'E-mail is too long'),
        name: z.string({ invalid_type_error: 'Name must be text' }).max(1000, 'Name is too long').nullish(),
      }),
      { required_error: 'List the addresses to invite', invalid_type_error: 'invites must be a list' },
    )
    .min(1, 'Add at least one address')
    .max(ROSTER_LIMITS.maxRows, `At most ${ROSTER_LIMITS.maxRows} addresses at a time`),
});
export type InvitationsInput = z.infer<typeof invitationsSchema>;

export const rosterCsvSchema = z.object({
  csv: z.string({ required_error: 'Paste or upload a CSV file', invalid_type_error: 'csv must be text' }),
});
