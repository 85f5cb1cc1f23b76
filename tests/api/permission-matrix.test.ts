/**
 * The permission matrix: generated from the route table itself (app.locals.routeSpecs), it
 * calls every API route as anonymous, owner, another grower, cohort lead, cohort observer and
 * admin, and checks each gets exactly what the route's declared access allows. A new route is
 * covered the moment it is added; a new path parameter needs a fixture below.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Access } from '../../server/http/access';
import type { RouteSpec } from '../../server/http/route';
import { ApiAgent, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

type Actor = 'anonymous' | 'owner' | 'otherGrower' | 'lead' | 'observer' | 'admin';
const actors: Actor[] = ['anonymous', 'owner', 'otherGrower', 'lead', 'observer', 'admin'];

/** What each access rule promises: allowed actors, and the status every other actor gets. */
function expectation(rule: Access): { allowed: Actor[]; denied: number } {
  switch (rule.kind) {
    case 'public':
      return { allowed: actors, denied: 0 };
    case 'signed-in':
      return { allowed: actors.filter((a) => a !== 'anonymous'), denied: 403 };
    case 'role': {
      const map: Record<Actor, string | null> = { anonymous: null, owner: 'grower', otherGrower: 'grower', lead: 'educator', observer: 'grower', admin: 'admin' };
      return { allowed: actors.filter((a) => map[a] && rule.roles.includes(map[a] as 'grower')), denied: 403 };
    }
    case 'cohort-lead':
      return { allowed: ['lead'], denied: 404 };
    case 'cohort-member':
      return { allowed: ['lead', 'owner', 'observer'], denied: 404 };
    case 'resource':
      // The owner always; cohort readers (lead, observer) too when the rule is 'reader'.
      return { allowed: rule.level === 'owner' ? ['owner'] : ['owner', 'lead', 'observer'], denied: 404 };
  }
}

let t: TestApp;
const agents = {} as Record<Actor, ApiAgent>;
const ids = {} as Record<string, string>;

/** Rebuilds the shared cohort so destructive calls in one route do not leak into the next. */
async function resetFixtures() {
  await t.ds.query('DELETE FROM cohorts');
  const [cohort] = await t.ds.query(`INSERT INTO cohorts (name, lead_id, join_code) VALUES ('Matrix', $1, 'MATRXC2D') RETURNING id`, [ids.leadUser]);
  ids.cohortId = cohort.id;
  const [m] = await t.ds.query(`INSERT INTO cohort_memberships (cohort_id, user_id, role, pseudonym) VALUES ($1, $2, 'contributor', 'Grower A1') RETURNING id`, [
    cohort.id,
    ids.ownerUser,
  ]);
  ids.membershipId = m.id;
  await t.ds.query(`INSERT INTO cohort_memberships (cohort_id, user_id, role, pseudonym) VALUES ($1, $2, 'observer', 'Observer B2')`, [cohort.id, ids.observerUser]);
}

beforeAll(async () => {
  t = await startTestApp({ authLimits: { signInPerWindow: 1000, resetPerWindow: 1000, windowMs: 60_000 } });
  for (const actor of actors) {
    agents[actor] = new ApiAgent(t.app);
    if (actor === 'anonymous') {
      await agents[actor].refreshCsrf();
      continue;
    }
    const u = await agents[actor].signUp({ email: uniqueEmail(actor), role: actor === 'lead' ? 'educator' : 'grower' });
    if (actor === 'admin') await t.ds.query(`UPDATE users SET role = 'admin' WHERE id = $1`, [u.id]);
    ids[`${actor}User`] = u.id;
  }
  await resetFixtures();
});

afterAll(async () => {
  await t.close();
});

/** Path parameters and the fixture each stands for. */
const paramFixture: Record<string, () => string> = {
  cohortId: () => ids.cohortId!,
  membershipId: () => ids.membershipId!,
  userId: () => ids.otherGrowerUser!,
};

function fillPath(path: string) {
  return path.replace(/:([A-Za-z]+)/g, (_m, name: string) => {
    const f = paramFixture[name];
    if (!f) throw new Error(`permission matrix: add a fixture for path parameter :${name}`);
    return f();
  });
}

describe('permission matrix', () => {
  it('covers a non-trivial route table', () => {
    const specs = t.app.locals.routeSpecs as RouteSpec[];
    expect(specs.length).toBeGreaterThan(20);
  });

  it('gives every actor on every route exactly what its access rule says', async () => {
    const specs = t.app.locals.routeSpecs as RouteSpec[];
    const leaks: string[] = [];
    for (const spec of specs) {
      // Sign-out would end the actors' sessions; it is covered by the auth tests.
      if (spec.path === '/auth/sign-out') continue;
      await resetFixtures();
      const { allowed, denied } = expectation(spec.access);
      // Denied actors first, so an allowed destructive call cannot hide a leak.
      const order = [...actors.filter((a) => !allowed.includes(a)), ...actors.filter((a) => allowed.includes(a))];
      for (const actor of order) {
        const url = `/api${fillPath(spec.path)}`;
        const agent = agents[actor];
        const res = spec.method === 'get' ? await agent.get(url) : await agent[spec.method](url, {});
        const expectedDenial = actor === 'anonymous' && spec.access.kind !== 'public' ? 401 : denied;
        if (allowed.includes(actor)) {
          if ([401, 403].includes(res.status) || (res.status === 404 && /Cohort|was not found/.test(res.body?.error?.message ?? '') && spec.access.kind !== 'public')) {
            leaks.push(`${spec.method.toUpperCase()} ${spec.path} as ${actor}: expected access, got ${res.status} ${res.body?.error?.message}`);
          }
        } else if (res.status !== expectedDenial) {
          leaks.push(`${spec.method.toUpperCase()} ${spec.path} as ${actor}: expected ${expectedDenial}, got ${res.status}`);
        }
        expect(res.status).toBeLessThan(500);
      }
    }
    expect(leaks).toEqual([]);
  });
});
