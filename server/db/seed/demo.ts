/**
 * The demo scenario: an invented dryland town, Saltbush Bend, whose garden network runs a
 * season of olla trials. Every place, person and number here is made up; the season itself
 * (gardens, trials, logs) is generated deterministically by season.ts from the plans in cast.ts.
 */
import type { DataSource } from 'typeorm';
import { hashPassword } from '../../auth/passwords';
import type { Logger } from '../../lib/logger';
import { newJoinCode } from '../../services/cohorts.service';
import { seedSeason } from './season';

export const DEMO_PASSWORD = 'olla-demo-2026';

export const demoAccounts = [
  { email: 'admin@saltbush.example', displayName: 'Site Admin', role: 'admin' },
  { email: 'marisol@saltbush.example', displayName: 'Marisol Quintero-Hale', role: 'educator' },
  { email: 'teacher@saltbush.example', displayName: 'Dev Okonjo-Lind', role: 'educator' },
  { email: 'ruth@saltbush.example', displayName: 'Ruth Abernathy-Sol', role: 'grower', language: 'en', unitSystem: 'us' },
  { email: 'tomas@saltbush.example', displayName: 'Tomás Verdejo', role: 'grower', language: 'es' },
  { email: 'ines@saltbush.example', displayName: 'Inés Carranza', role: 'grower', language: 'es' },
  { email: 'wendell@saltbush.example', displayName: 'Wendell Pike', role: 'grower' },
  { email: 'priya@saltbush.example', displayName: 'Priya Dunmore', role: 'grower' },
  { email: 'student@saltbush.example', displayName: 'Ada Student', role: 'grower' },
  { email: 'odalys@saltbush.example', displayName: 'Odalys Ferrant', role: 'grower' },
  { email: 'bram@saltbush.example', displayName: 'Bram Kettleson', role: 'grower' },
  { email: 'lupe@saltbush.example', displayName: 'Lupe Arrowood', role: 'grower', language: 'es' },
  { email: 'caspian@saltbush.example', displayName: 'Caspian Reyes-Moll', role: 'grower' },
  { email: 'nettie@saltbush.example', displayName: 'Nettie Vance-Orozco', role: 'grower' },
  { email: 'idris@saltbush.example', displayName: 'Idris Calloway', role: 'grower' },
  { email: 'maren@saltbush.example', displayName: 'Maren Sotelo', role: 'grower' },
] as const;

/**
 * When the demo's cohorts began, on the invented season's calendar (before the first gardens are set
 * up in March; the class in the school year's first weeks), not the day the demo is loaded.
 */
const NETWORK_STARTED = '2026-03-02T16:00:00Z';
const CLASS_STARTED = '2026-08-24T15:00:00Z';

/** Loads the invented demo scenario into an empty database (first start, `npm run db:seed`). */
export async function seedDemoIfEmpty(dataSource: DataSource, logger: Logger): Promise<boolean> {
  const [{ count }] = (await dataSource.query('SELECT count(*)::int AS count FROM users')) as [{ count: number }];
  if (count > 0) return false;
  logger.info('Empty database: loading the Saltbush Bend demo scenario.');
  const hash = await hashPassword(DEMO_PASSWORD);
  await dataSource.transaction(async (tx) => {
    const ids: Record<string, string> = {};
    for (const a of demoAccounts) {
      const [row] = (await tx.query(
        `INSERT INTO users (email, password_hash, display_name, role, language, unit_system, email_verified_at)
         VALUES ($1, $2, $3, $4, $5, $6, now()) RETURNING id`,
        [a.email, hash, a.displayName, a.role, 'language' in a ? a.language : 'en', 'unitSystem' in a ? a.unitSystem : 'metric'],
      )) as { id: string }[];
      ids[a.email] = row!.id;
    }
    const [network] = (await tx.query(
      `INSERT INTO cohorts (name, description, kind, lead_id, join_code, licence, created_at)
       VALUES ($1, $2, 'network', $3, $4, 'CC-BY-4.0', $5) RETURNING id`,
      [
        'Saltbush Bend Garden Network',
        'Home gardens across Saltbush Bend comparing buried clay pots with surface watering through one summer.',
        ids['marisol@saltbush.example'],
        newJoinCode(),
        NETWORK_STARTED,
      ],
    )) as { id: string }[];
    const [klass] = (await tx.query(
      `INSERT INTO cohorts (name, description, kind, lead_id, join_code, licence, created_at)
       VALUES ($1, $2, 'class', $3, $4, 'CC-BY-4.0', $5) RETURNING id`,
      ['Saltbush Bend High — Biology 2', 'A class reading the network’s pooled results for their reports.', ids['teacher@saltbush.example'], newJoinCode(), CLASS_STARTED],
    )) as { id: string }[];
    const members: [string, string, 'contributor' | 'observer', string][] = [
      [network!.id, 'ruth@saltbush.example', 'contributor', 'Grower B12'],
      [network!.id, 'tomas@saltbush.example', 'contributor', 'Grower K7'],
      [network!.id, 'ines@saltbush.example', 'contributor', 'Grower R31'],
      [network!.id, 'wendell@saltbush.example', 'contributor', 'Grower T44'],
      [network!.id, 'priya@saltbush.example', 'contributor', 'Grower M58'],
      [network!.id, 'odalys@saltbush.example', 'contributor', 'Grower X12'],
      [network!.id, 'bram@saltbush.example', 'contributor', 'Grower D23'],
      [network!.id, 'lupe@saltbush.example', 'contributor', 'Grower F16'],
      [network!.id, 'caspian@saltbush.example', 'contributor', 'Grower L40'],
      [network!.id, 'nettie@saltbush.example', 'contributor', 'Grower N05'],
      [network!.id, 'idris@saltbush.example', 'contributor', 'Grower S61'],
      [network!.id, 'maren@saltbush.example', 'contributor', 'Grower V27'],
      [network!.id, 'student@saltbush.example', 'observer', 'Observer H9'],
      [klass!.id, 'student@saltbush.example', 'observer', 'Observer Q2'],
    ];
    for (const [i, [cohortId, email, role, pseudonym]] of members.entries()) {
      // Members join in the week after their cohort starts, not on the day the demo is loaded.
      const joined = new Date(Date.parse(cohortId === network!.id ? NETWORK_STARTED : CLASS_STARTED) + ((i % 7) + 1) * 86_400_000).toISOString();
      await tx.query(`INSERT INTO cohort_memberships (cohort_id, user_id, role, pseudonym, created_at) VALUES ($1, $2, $3, $4, $5)`, [cohortId, ids[email], role, pseudonym, joined]);
    }
    // The 2026 season: gardens, trials, pots, weather and every log, generated from cast.ts.
    const counts = await seedSeason(tx, ids, network!.id);
    logger.info({ counts }, 'Demo season generated.');
  });
  return true;
}
