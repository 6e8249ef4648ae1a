import { shopSettingsSchema } from '@shared/schemas/settings';
import { defineEndpoint } from './endpoint';

export const settings = defineEndpoint({
  method: 'GET',
  path: '/admin/settings',
  access: 'admin',
  answer: shopSettingsSchema,
  summary: 'The winding shop’s e-mail address',
});

export const saveSettings = defineEndpoint({
  method: 'PUT',
  path: '/admin/settings',
  access: 'admin',
  body: shopSettingsSchema,
  answer: shopSettingsSchema,
  summary: 'Set the winding shop’s e-mail address',
});
