import { createGardenInputSchema, updateGardenInputSchema } from '@shared/schemas/gardens';
import { listWeatherQuerySchema, weatherDayInputSchema } from '@shared/schemas/logs';
import type { z } from 'zod';
import type { AppContext } from '../context';
import { access } from '../http/access';
import { handle, route, type RouteSpec } from '../http/route';
import { validate } from '../middleware/validate';
import { gardensService } from '../services/gardens.service';

export function gardenRoutes(ctx: AppContext): RouteSpec[] {
  const svc = gardensService(ctx);
  const id = (v: unknown) => String(v);
  return [
    route('get', '/gardens', access.signedIn, handle(async (req, res) => res.json({ data: await svc.list(req.user!.id) }))),
    route(
      'post',
      '/gardens',
      access.signedIn,
      validate(createGardenInputSchema),
      handle(async (req, res) => res.status(201).json({ data: await svc.create(req.user!.id, req.body) })),
    ),
    route('get', '/gardens/:gardenId', access.owner('garden', 'gardenId'), handle(async (req, res) => res.json({ data: await svc.get(id(req.params.gardenId)) }))),
    route(
      'patch',
      '/gardens/:gardenId',
      access.owner('garden', 'gardenId'),
      validate(updateGardenInputSchema),
      handle(async (req, res) => res.json({ data: await svc.update(id(req.params.gardenId), req.body) })),
    ),
    route(
      'delete',
      '/gardens/:gardenId',
      access.owner('garden', 'gardenId'),
      handle(async (req, res) => {
        await svc.remove(id(req.params.gardenId));
        res.status(204).end();
      }),
    ),
    route(
      'get',
      '/gardens/:gardenId/weather',
      access.owner('garden', 'gardenId'),
      validate(listWeatherQuerySchema, 'query'),
      handle(async (req, res) => {
        const q = res.locals.query as z.infer<typeof listWeatherQuerySchema>;
        res.json({ data: await svc.listWeather(id(req.params.gardenId), q.from, q.to) });
      }),
    ),
    route(
      'put',
      '/gardens/:gardenId/weather',
      access.owner('garden', 'gardenId'),
      validate(weatherDayInputSchema),
      handle(async (req, res) => res.json({ data: await svc.upsertWeather(id(req.params.gardenId), req.user!.id, req.body) })),
    ),
    route(
      'delete',
      '/weather-days/:weatherDayId',
      access.owner('weather-day', 'weatherDayId'),
      handle(async (req, res) => {
        await svc.removeWeather(id(req.params.weatherDayId));
        res.status(204).end();
      }),
    ),
  ];
}
