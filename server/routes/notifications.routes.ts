import { unsubscribeInputSchema, updateNotificationPreferencesInputSchema } from '@shared/schemas/notifications';
import type { AppContext } from '../context';
import { access } from '../http/access';
import { handle, route, type RouteSpec } from '../http/route';
import { validate } from '../middleware/validate';
import { frostGardens, getPreferences, presentFrostWarning, trialForecast, unsubscribe, updatePreferences } from '../services/reminders.service';

/** Reminder preferences, the sign-in-free unsubscribe link, the refill forecast and frost warnings. */
export function notificationRoutes(ctx: AppContext): RouteSpec[] {
  const id = (v: unknown) => String(v);
  return [
    route('get', '/account/notifications', access.signedIn, handle(async (req, res) => res.json({ data: await getPreferences(ctx.ds, req.user!.id) }))),
    route(
      'patch',
      '/account/notifications',
      access.signedIn,
      validate(updateNotificationPreferencesInputSchema),
      handle(async (req, res) => res.json({ data: await updatePreferences(ctx.ds, req.user!.id, req.body) })),
    ),
    // Public: the link in every e-mail works without signing in; the HMAC in the token is the proof.
    route(
      'post',
      '/notifications/unsubscribe',
      access.public,
      validate(unsubscribeInputSchema),
      handle(async (req, res) => res.json({ data: await unsubscribe(ctx, req.body.token) })),
    ),
    route(
      'get',
      '/trials/:trialId/forecast',
      access.owner('trial', 'trialId'),
      handle(async (req, res) => res.json({ data: await trialForecast(ctx.ds, id(req.params.trialId), req.user!.id, ctx.now()) })),
    ),
    route(
      'get',
      '/frost-warnings',
      access.signedIn,
      handle(async (req, res) => res.json({ data: (await frostGardens(ctx.ds, ctx.now(), { userId: req.user!.id, recipientsOnly: false })).map(presentFrostWarning) })),
    ),
  ];
}
