import type { DataSource } from 'typeorm';
import type { ResourceResolver } from './access';

/**
 * SQL that decides a user's relation to a trial: 'owner', 'reader' (the trial is shared, not
 * withdrawn, into a cohort the user leads or belongs to), or nothing. $1 = trial id, $2 = user id.
 */
const trialLevelSql = (trialIdExpr: string) => `
  SELECT CASE
           WHEN t.owner_id = $2 THEN 'owner'
           WHEN EXISTS (
             SELECT 1 FROM trial_shares s
               JOIN cohorts c ON c.id = s.cohort_id
               LEFT JOIN cohort_memberships m ON m.cohort_id = c.id AND m.user_id = $2
              WHERE s.trial_id = t.id AND s.withdrawn_at IS NULL AND (c.lead_id = $2 OR m.id IS NOT NULL)
           ) THEN 'reader'
         END AS level
    FROM trials t
   WHERE t.id = ${trialIdExpr}`;

function viaTrial(trialIdExpr: string): ResourceResolver {
  const sql = trialLevelSql(trialIdExpr);
  return async (ds: DataSource, userId: string, id: string) => {
    const rows = (await ds.query(sql, [id, userId])) as { level: 'owner' | 'reader' | null }[];
    return rows[0]?.level ?? null;
  };
}

function ownedBy(sql: string): ResourceResolver {
  return async (ds, userId, id) => {
    const rows = (await ds.query(sql, [id])) as { owner_id: string }[];
    return rows[0]?.owner_id === userId ? 'owner' : null;
  };
}

/** Every grower-owned resource kind and how to find its owner (or cohort readers). */
export const notebookResolvers: Record<string, ResourceResolver> = {
  garden: ownedBy('SELECT owner_id FROM gardens WHERE id = $1'),
  trial: viaTrial('$1'),
  plot: viaTrial('(SELECT trial_id FROM plots WHERE id = $1)'),
  pot: ownedBy('SELECT owner_id FROM pots WHERE id = $1'),
  'seep-test': ownedBy('SELECT p.owner_id FROM seep_tests s JOIN pots p ON p.id = s.pot_id WHERE s.id = $1'),
  'water-event': viaTrial('(SELECT trial_id FROM water_events WHERE id = $1)'),
  'moisture-reading': viaTrial('(SELECT trial_id FROM moisture_readings WHERE id = $1)'),
  harvest: viaTrial('(SELECT trial_id FROM harvests WHERE id = $1)'),
  observation: viaTrial('(SELECT trial_id FROM observations WHERE id = $1)'),
  photo: viaTrial('(SELECT o.trial_id FROM photos p JOIN observations o ON o.id = p.observation_id WHERE p.id = $1)'),
  'weather-day': ownedBy('SELECT g.owner_id FROM weather_days w JOIN gardens g ON g.id = w.garden_id WHERE w.id = $1'),
};
