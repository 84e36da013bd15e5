/** The monthly letter switch: the one input of PATCH /api/households/{id}/letter, shared with the account page's island. */
import { z } from 'zod';

/** Body of PATCH /api/households/{id}/letter, e.g. { monthlyLetter: false }. */
export const letterSetting = z.object({ monthlyLetter: z.boolean() }).strict();

export type LetterSetting = z.infer<typeof letterSetting>;
