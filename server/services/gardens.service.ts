import type { CreateGardenInput, Garden, UpdateGardenInput } from '@shared/schemas/gardens';
import type { WeatherDayInput } from '@shared/schemas/logs';
import type { AppContext } from '../context';
import { GardenEntity } from '../entities/garden.entity';
import { WeatherDayEntity } from '../entities/weather-day.entity';
import { AppError } from '../lib/app-error';

/** The columns a garden is presented from, as SQL returns them (camelCase aliases). */
interface GardenRow {
  id: string;
  name: string;
  latitudeDeg: number;
  longitudeDeg: number;
  elevationM: number;
  soilTexture: Garden['soilTexture'];
  coastal: boolean;
  notes: string;
  timeZone: string;
  trialCount: number;
  createdAt: Date;
  updatedAt: Date;
}

const gardenSelect = `
  SELECT g.id, g.name, g.latitude_deg AS "latitudeDeg", g.longitude_deg AS "longitudeDeg", g.elevation_m AS "elevationM",
         g.soil_texture AS "soilTexture", g.coastal, g.notes, g.time_zone AS "timeZone", g.created_at AS "createdAt", g.updated_at AS "updatedAt",
         (SELECT count(*)::int FROM trials t WHERE t.garden_id = g.id) AS "trialCount"
    FROM gardens g`;

export function presentGarden(g: GardenRow): Garden {
  return { ...g, createdAt: g.createdAt.toISOString(), updatedAt: g.updatedAt.toISOString() };
}

export function presentWeatherDay(w: WeatherDayEntity) {
  return {
    id: w.id,
    gardenId: w.gardenId,
    day: w.day,
    forecast: w.forecast,
    tMinC: w.tMinC,
    tMaxC: w.tMaxC,
    rainMm: w.rainMm,
    rhMinPct: w.rhMinPct,
    rhMaxPct: w.rhMaxPct,
    windSpeedMs: w.windSpeedMs,
    windHeightM: w.windHeightM,
    sunshineHours: w.sunshineHours,
    solarRadiationMJ: w.solarRadiationMJ,
  };
}

/**
 * The schema has checked the name against Intl; PostgreSQL has its own copy of the IANA database,
 * and a zone it lacks would make every daily query fail. Refused here as the schema refuses.
 */
async function assertPostgresKnowsZone(ctx: AppContext, timeZone: string | undefined) {
  if (timeZone === undefined) return;
  const known = (await ctx.ds.query('SELECT 1 FROM pg_timezone_names WHERE name = $1', [timeZone])) as unknown[];
  if (known.length === 0) {
    const message = `"${timeZone}" is not a time zone the database knows; choose a neighbouring zone with the same clock.`;
    throw AppError.validation(message, [{ path: 'timeZone', message, reason: 'unknown_time_zone' }]).because('unknown_time_zone');
  }
}

export function gardensService(ctx: AppContext) {
  const gardens = ctx.ds.getRepository(GardenEntity);
  const weather = ctx.ds.getRepository(WeatherDayEntity);

  async function load(id: string): Promise<GardenRow> {
    const rows = (await ctx.ds.query(`${gardenSelect} WHERE g.id = $1`, [id])) as GardenRow[];
    if (!rows[0]) throw AppError.notFound('Garden');
    return rows[0];
  }

  return {
    async list(ownerId: string): Promise<Garden[]> {
      const rows = (await ctx.ds.query(`${gardenSelect} WHERE g.owner_id = $1 ORDER BY g.name`, [ownerId])) as GardenRow[];
      return rows.map(presentGarden);
    },
    async get(id: string): Promise<Garden> {
      return presentGarden(await load(id));
    },
    async create(ownerId: string, input: CreateGardenInput): Promise<Garden> {
      await assertPostgresKnowsZone(ctx, input.timeZone);
      const { identifiers } = await gardens.insert({ ...input, ownerId });
      return presentGarden(await load(identifiers[0]!.id as string));
    },
    async update(id: string, input: UpdateGardenInput): Promise<Garden> {
      await assertPostgresKnowsZone(ctx, input.timeZone);
      if (Object.keys(input).length) await gardens.update(id, input);
      return presentGarden(await load(id));
    },
    async remove(id: string): Promise<void> {
      await gardens.delete(id);
    },

    async listWeather(gardenId: string, from?: string, to?: string) {
      const qb = weather.createQueryBuilder('w').where('w.garden_id = :gardenId', { gardenId }).orderBy('w.day', 'ASC').addOrderBy('w.forecast', 'ASC');
      if (from) qb.andWhere('w.day >= :from', { from });
      if (to) qb.andWhere('w.day <= :to', { to });
      return (await qb.getMany()).map(presentWeatherDay);
    },
    /** One record per garden, day and kind (observed/forecast): a second entry for the same day replaces the first. */
    async upsertWeather(gardenId: string, userId: string, input: WeatherDayInput) {
      await weather.upsert({ ...input, gardenId, enteredBy: userId }, { conflictPaths: ['gardenId', 'day', 'forecast'] });
      const saved = await weather.findOneByOrFail({ gardenId, day: input.day, forecast: input.forecast });
      return presentWeatherDay(saved);
    },
    async removeWeather(id: string) {
      await weather.delete(id);
    },
  };
}
