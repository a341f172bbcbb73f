import type { DataSource } from 'typeorm';
import { notificationSettingsBody, notificationSettingsResponse } from '@shared/schemas/notifications.js';
import type { Config } from '../config.js';
import type { RouteSpec } from '../http/route-registry.js';
import { scopeOf } from '../policies/tenant-scope.js';
import { useAlertLinks } from '../services/alerts/alert-checks.js';
import { readNotificationSettings } from '../services/alerts/read-notification-settings.js';
import { saveNotificationSettings } from '../services/alerts/save-notification-settings.js';

export function notificationRoutes(ds: DataSource, config: Config): RouteSpec[] {
  // Alert mails (sent after a recompute or by the hourly check) link to this app's public address.
  useAlertLinks(config);
  return [
    {
      method: 'get',
      path: '/api/notifications',
      response: notificationSettingsResponse,
      access: 'data.read',
      tenantScoped: true,
      description: 'Your own e-mail alert choices in the active organisation, with the units in your scope to choose among',
      handler: async (req, res) => res.json(await readNotificationSettings(ds, scopeOf(req.actor))),
    },
    {
      method: 'put',
      path: '/api/notifications',
      body: notificationSettingsBody,
      response: notificationSettingsResponse,
      access: 'data.read',
      tenantScoped: true,
      description:
        'Replaces your own e-mail alert choices in the active organisation: the weekly digest, conditions for every unit, and per unit (only units in your scope)',
      handler: async (req, res) => res.json(await saveNotificationSettings(ds, scopeOf(req.actor), req.body)),
    },
  ];
}
