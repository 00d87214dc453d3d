import { z } from 'zod';

/** Mirrors API_TOKEN_SCOPES of db/schema.ts (kept here so client forms do not import the schema module). */
export const TOKEN_SCOPES = ['read', 'write'] as const;

/** Creating a personal API token: shared by the account form and its server action. */
export const apiTokenInputSchema = z.object({
  name: z
    .string({ error: 'Give the token a name.' })
    .trim()
    .min(1, 'Give the token a name, e.g. “Bench logger” or “Spreadsheet export”.')
    .max(80, 'Use at most 80 characters.'),
  scope: z.enum(TOKEN_SCOPES, 'Choose read or write.'),
});
export type ApiTokenInput = z.input<typeof apiTokenInputSchema>;

export const apiTokenRevokeSchema = z.object({ tokenId: z.string().min(1).max(100) });

export const unitSystemSchema = z.enum(['metric', 'imperial'], 'Choose metric or imperial.');
