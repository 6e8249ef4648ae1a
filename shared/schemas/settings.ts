import * as z from 'zod';

/** The site settings an administrator keeps: where release mail for the winding shop goes. */
export const shopSettingsSchema = z.object({ shopEmail: z.email({ error: 'Not a valid e-mail address' }).max(200) }).strict();
export type ShopSettings = z.infer<typeof shopSettingsSchema>;
