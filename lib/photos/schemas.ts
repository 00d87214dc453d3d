import { z } from 'zod';
import { ALT_TEXT_MAX } from './config';

/** Alt text as sent with an upload (may be empty: it is required before the item is submitted for review). */
export const uploadAltSchema = z
  .string()
  .trim()
  .max(ALT_TEXT_MAX, `Alt text can be at most ${ALT_TEXT_MAX} characters.`);

/** PATCH /api/v1/gear/{slug}/photos/{id} body. */
export const photoAltUpdateSchema = z.object({
  alt: z
    .string({ error: 'Describe the photo for people who cannot see it.' })
    .trim()
    .min(1, 'Describe the photo for people who cannot see it.')
    .max(ALT_TEXT_MAX, `Alt text can be at most ${ALT_TEXT_MAX} characters.`),
});

export type PhotoAltUpdate = z.infer<typeof photoAltUpdateSchema>;
