/**
 * Account e-mails in the recipient's language (server/mail/templates.ts): a Spanish account gets
 * its confirmation and password reset in Spanish, and a cohort invitation is written in the
 * invitee's language (the inviter's when the address has no account yet), with its expiry date
 * written the way that language writes dates.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiAgent, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

async function account(o: { language: 'en' | 'es'; role?: 'grower' | 'educator'; name: string }) {
  const a = new ApiAgent(t.app);
  await a.refreshCsrf();
  const email = uniqueEmail('mail-es');
  const res = await a.post('/api/auth/sign-up', { email, password: 'arcilla-sombra-riego-5', displayName: o.name, role: o.role ?? 'grower', language: o.language });
  expect(res.status).toBe(201);
  a.csrf = res.body.data.csrfToken;
  return { a, email };
}

describe('e-mails in the recipient’s language', () => {
  it('confirms the address and resets the password in Spanish for a Spanish account', async () => {
    const { email } = await account({ language: 'es', name: 'Inés' });
    const confirm = await t.sink.waitFor((m) => m.to.includes(email) && m.subject === 'Confirma tu correo en Seepwise');
    expect(confirm.text).toMatch(/^Hola, Inés:/);
    expect(confirm.text).toContain('Confirmar mi correo: ');

    const b = new ApiAgent(t.app);
    await b.refreshCsrf();
    expect((await b.post('/api/auth/password-reset/request', { email })).status).toBe(202);
    const reset = await t.sink.waitFor((m) => m.to.includes(email) && m.subject.startsWith('Restablece'));
    expect(reset.subject).toBe('Restablece tu contraseña de Seepwise');
    expect(reset.text).toContain('Elegir una contraseña nueva: ');
    expect(reset.text).not.toMatch(/Hello|Choose a new password/);
  });

  it('invites in the invitee’s language, with the expiry day written as that language writes dates', async () => {
    const { a: lead } = await account({ language: 'en', role: 'educator', name: 'Lead' });
    const cohort = (await lead.post('/api/cohorts', { name: 'Huertas del Sur' })).body.data;
    const { email: es } = await account({ language: 'es', name: 'Tomás' });
    const { email: en } = await account({ language: 'en', name: 'Ruth' });
    // Invitations last 14 days (server/services/cohorts.service.ts INVITE_TTL_MS): from 2 Dec 2026 10:00 UTC to 16 Dec 2026.
    t.clock.now = new Date('2026-12-02T10:00:00Z');
    try {
      expect((await lead.post(`/api/cohorts/${cohort.id}/invitations`, { email: es, role: 'observer' })).status).toBe(201);
      expect((await lead.post(`/api/cohorts/${cohort.id}/invitations`, { email: en, role: 'contributor' })).status).toBe(201);
    } finally {
      t.clock.now = null;
    }
    const toEs = await t.sink.waitFor((m) => m.to.includes(es) && /Huertas del Sur/.test(m.subject));
    expect(toEs.subject).toBe('Invitación a «Huertas del Sur» en Seepwise');
    expect(toEs.text).toContain('como observador (lees y exportas los datos agrupados)');
    // CLDR's long date pattern for Spanish is "d 'de' MMMM 'de' y", month names in lower case
    // (the RAE's spelling rule for month names; from memory).
    expect(toEs.text).toContain('La invitación caduca el 16 de diciembre de 2026.');
    expect(toEs.html).toContain('caduca el 16 de diciembre de 2026');

    const toEn = await t.sink.waitFor((m) => m.to.includes(en) && /Huertas del Sur/.test(m.subject));
    expect(toEn.subject).toBe('You are invited to "Huertas del Sur" on Seepwise');
    // CLDR's long date pattern for British English is "d MMMM y".
    expect(toEn.text).toContain('The invitation expires on 16 December 2026.');
  });

  it('invites an address without an account in the inviter’s language', async () => {
    const { a: lead } = await account({ language: 'es', role: 'educator', name: 'Marisol' });
    const cohort = (await lead.post('/api/cohorts', { name: 'Clase de riego' })).body.data;
    const stranger = uniqueEmail('nadie');
    expect((await lead.post(`/api/cohorts/${cohort.id}/invitations`, { email: stranger })).status).toBe(201);
    const mail = await t.sink.waitFor((m) => m.to.includes(stranger));
    expect(mail.subject).toBe('Invitación a «Clase de riego» en Seepwise');
  });
});
