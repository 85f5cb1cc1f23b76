import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiAgent, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

async function educator() {
  const a = new ApiAgent(t.app);
  const u = await a.signUp({ email: uniqueEmail('educator'), role: 'educator' });
  return { a, u };
}
async function grower(prefix = 'grower') {
  const a = new ApiAgent(t.app);
  const email = uniqueEmail(prefix);
  const u = await a.signUp({ email });
  return { a, u, email };
}

describe('POST /api/cohorts', () => {
  it('lets an educator create a cohort with a join code', async () => {
    const { a } = await educator();
    const res = await a.post('/api/cohorts', { name: 'Dry Creek County Programme', kind: 'programme' });
    expect(res.status).toBe(201);
    expect(res.body.data.myRole).toBe('lead');
    expect(res.body.data.joinCode).toMatch(/^[2-9A-HJKMNP-Z]{8}$/);
    expect(res.body.data.licence).toBe('CC-BY-4.0');
  });

  it('refuses growers with 403 and bad input with 400', async () => {
    const { a } = await grower();
    expect((await a.post('/api/cohorts', { name: 'Mine' })).status).toBe(403);
    const { a: e } = await educator();
    const bad = await e.post('/api/cohorts', { name: 'x' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toBe('name');
  });
});

describe('joining by code', () => {
  it('joins with a pseudonym, never the real name, and rotating the code stops the old one', async () => {
    const { a: lead } = await educator();
    const cohort = (await lead.post('/api/cohorts', { name: 'Class 7B' })).body.data;
    const { a: g } = await grower();
    const joined = await g.post('/api/cohorts/join', { code: cohort.joinCode.toLowerCase().replace(/(.{4})/, '$1-') });
    expect(joined.status).toBe(201);
    expect(joined.body.data.myRole).toBe('contributor');
    expect(joined.body.data.myPseudonym).toMatch(/^Grower [A-Z]\d+$/);
    expect(joined.body.data.joinCode).toBeNull();

    const members = await lead.get(`/api/cohorts/${cohort.id}/members`);
    expect(members.body.data).toHaveLength(1);
    expect(JSON.stringify(members.body.data)).not.toContain('@');

    const rotated = await lead.post(`/api/cohorts/${cohort.id}/join-code`);
    expect(rotated.body.data.joinCode).not.toBe(cohort.joinCode);
    const { a: late } = await grower();
    const stale = await late.post('/api/cohorts/join', { code: cohort.joinCode });
    expect(stale.status).toBe(400);
    expect(stale.body.error.details[0].path).toBe('code');
  });

  it.each([['ABC'], ['K7QM-4XP0'], ['']])('refuses the mistyped code %j with a clear message', async (code) => {
    const { a } = await grower();
    const res = await a.post('/api/cohorts/join', { code });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].message).toMatch(/8 letters and digits/);
  });

  it('refuses a full cohort and a closed one, and changes nothing', async () => {
    const { a: lead } = await educator();
    const cohort = (await lead.post('/api/cohorts', { name: 'Tiny', capacity: 1 })).body.data;
    const { a: first } = await grower();
    expect((await first.post('/api/cohorts/join', { code: cohort.joinCode })).status).toBe(201);
    const { a: second } = await grower();
    const full = await second.post('/api/cohorts/join', { code: cohort.joinCode });
    expect(full.status).toBe(409);
    expect(full.body.error.message).toMatch(/full/);

    await lead.patch(`/api/cohorts/${cohort.id}`, { capacity: 10, closed: true });
    const closed = await second.post('/api/cohorts/join', { code: cohort.joinCode });
    expect(closed.status).toBe(409);
    expect(closed.body.error.message).toMatch(/closed/);
    const [{ n }] = await t.ds.query('SELECT count(*)::int AS n FROM cohort_memberships WHERE cohort_id = $1', [cohort.id]);
    expect(n).toBe(1);
  });

  it('joins as an observer when asked, and a member may leave', async () => {
    const { a: lead } = await educator();
    const cohort = (await lead.post('/api/cohorts', { name: 'Biology 2' })).body.data;
    const { a: s } = await grower('student');
    const res = await s.post('/api/cohorts/join', { code: cohort.joinCode, role: 'observer' });
    expect(res.body.data.myRole).toBe('observer');
    expect(res.body.data.myPseudonym).toMatch(/^Observer /);
    expect((await s.post(`/api/cohorts/${cohort.id}/leave`)).status).toBe(204);
    expect((await s.get(`/api/cohorts/${cohort.id}`)).status).toBe(404);
  });
});

describe('invitations by e-mail', () => {
  it('e-mails a link that the invited address can accept once', async () => {
    const { a: lead } = await educator();
    const cohort = (await lead.post('/api/cohorts', { name: 'Mesa Growers' })).body.data;
    const { a: g, email } = await grower();
    const inv = await lead.post(`/api/cohorts/${cohort.id}/invitations`, { email, role: 'contributor' });
    expect(inv.status).toBe(201);
    const mail = await t.sink.waitFor((m) => m.to.includes(email) && /Mesa Growers/.test(m.subject));
    const token = decodeURIComponent(mail.text.match(/join\?invite=([A-Za-z0-9_%-]+)/)![1]!);

    const preview = await g.post('/api/invitations/preview', { token });
    expect(preview.body.data).toEqual({ cohortName: 'Mesa Growers', role: 'contributor', expired: false, accepted: false });
    const { a: stranger } = await grower('stranger');
    expect((await stranger.post('/api/invitations/accept', { token })).status).toBe(403);
    const ok = await g.post('/api/invitations/accept', { token });
    expect(ok.status).toBe(201);
    expect(ok.body.data.myRole).toBe('contributor');
    const again = await g.post('/api/invitations/accept', { token });
    expect(again.status).toBe(409);
  });

  it('refuses an expired invitation', async () => {
    const { a: lead } = await educator();
    const cohort = (await lead.post('/api/cohorts', { name: 'Late Bloomers' })).body.data;
    const { a: g, email } = await grower();
    await lead.post(`/api/cohorts/${cohort.id}/invitations`, { email });
    const mail = await t.sink.waitFor((m) => m.to.includes(email) && /Late Bloomers/.test(m.subject));
    const token = decodeURIComponent(mail.text.match(/join\?invite=([A-Za-z0-9_%-]+)/)![1]!);
    t.clock.now = new Date(Date.now() + 15 * 24 * 3600 * 1000);
    try {
      const res = await g.post('/api/invitations/accept', { token });
      expect(res.status).toBe(409);
      expect(res.body.error.message).toMatch(/expired/);
    } finally {
      t.clock.now = null;
    }
  });

  it('refuses to invite into a closed cohort', async () => {
    const { a: lead } = await educator();
    const cohort = (await lead.post('/api/cohorts', { name: 'Shut' })).body.data;
    await lead.patch(`/api/cohorts/${cohort.id}`, { closed: true });
    const res = await lead.post(`/api/cohorts/${cohort.id}/invitations`, { email: uniqueEmail() });
    expect(res.status).toBe(409);
    const [{ n }] = await t.ds.query('SELECT count(*)::int AS n FROM cohort_invitations WHERE cohort_id = $1', [cohort.id]);
    expect(n).toBe(0);
  });
});
