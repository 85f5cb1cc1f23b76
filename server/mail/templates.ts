import type { QualityFlag } from '@shared/schemas/cohort-results';
import { toDisplay, unitLabel, type UnitSystem } from '@shared/units';

/**
 * Account e-mails in the recipient's language, as plain text and simple HTML. Links are built
 * from the public base URL; every value put into HTML is escaped.
 */
export type Lang = 'en' | 'es';

export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

function layout(paragraphs: string[], link?: { href: string; label: string }): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 12px">${escapeHtml(p)}</p>`).join('');
  const button = link
    ? `<p style="margin:16px 0"><a href="${escapeHtml(link.href)}" style="background:#9a4525;color:#fff;padding:10px 16px;border-radius:8px;text-decoration:none">${escapeHtml(link.label)}</a></p><p style="font-size:12px;color:#5f5448">${escapeHtml(link.href)}</p>`
    : '';
  return `<!doctype html><html><body style="font-family:'IBM Plex Sans',Arial,sans-serif;color:#2b241d;background:#fdfaf5;padding:24px"><div style="max-width:560px;margin:auto;background:#fff;border:1px solid #ede1cd;border-radius:12px;padding:24px"><p style="font-weight:600;color:#9a4525">Seepwise</p>${body}${button}</div></body></html>`;
}

function build(subject: string, paragraphs: string[], link?: { href: string; label: string }): MailContent {
  const text = [...paragraphs, ...(link ? [`${link.label}: ${link.href}`] : []), '', '— Seepwise'].join('\n\n');
  return { subject, text, html: layout(paragraphs, link) };
}

export const mailTemplates = {
  passwordReset(lang: Lang, name: string, href: string): MailContent {
    return lang === 'es'
      ? build('Restablece tu contraseña de Seepwise', [`Hola, ${name}:`, 'Alguien (esperamos que tú) pidió restablecer la contraseña de tu cuenta. El enlace funciona una sola vez y caduca en una hora.', 'Si no lo pediste, ignora este mensaje: tu contraseña no cambia.'], { href, label: 'Elegir una contraseña nueva' })
      : build('Reset your Seepwise password', [`Hello ${name},`, 'Someone (we hope you) asked to reset the password of your account. The link works once and expires in one hour.', 'If it was not you, ignore this message: your password stays as it is.'], { href, label: 'Choose a new password' });
  },
  verifyEmail(lang: Lang, name: string, href: string): MailContent {
    return lang === 'es'
      ? build('Confirma tu correo en Seepwise', [`Hola, ${name}:`, 'Confirma que esta dirección es tuya para recibir recordatorios de riego y avisos de helada.'], { href, label: 'Confirmar mi correo' })
      : build('Confirm your e-mail for Seepwise', [`Hello ${name},`, 'Confirm that this address is yours so refill reminders and frost warnings reach you.'], { href, label: 'Confirm my e-mail' });
  },
  cohortInvitation(lang: Lang, cohortName: string, role: 'contributor' | 'observer', href: string, expiresAt: Date): MailContent {
    const until = formatInstantDay(lang, expiresAt);
    const roleEn = role === 'contributor' ? 'a contributor (you share your own trials)' : 'an observer (you read and export the pooled data)';
    const roleEs = role === 'contributor' ? 'colaborador (compartes tus propios ensayos)' : 'observador (lees y exportas los datos agrupados)';
    return lang === 'es'
      ? build(`Invitación a «${cohortName}» en Seepwise`, [`Te han invitado a unirte a «${cohortName}» como ${roleEs}.`, `Los demás miembros te verán con un seudónimo, nunca con tu nombre. La invitación caduca el ${until}.`], { href, label: 'Ver la invitación' })
      : build(`You are invited to "${cohortName}" on Seepwise`, [`You have been invited to join "${cohortName}" as ${roleEn}.`, `Other members see you under a pseudonym, never your name. The invitation expires on ${until}.`], { href, label: 'Open the invitation' });
  },
};

// ——— Notifications: refill reminders, frost warnings and the weekly digest ———

/** A part of a notification e-mail: an optional heading (or subheading), paragraphs, a list whose items may carry a link, and a closing link. */
interface NoticeSection {
  heading?: string;
  subheading?: string;
  paragraphs?: string[];
  items?: { text: string; link?: { href: string; label: string } }[];
  link?: { text: string; href: string; label: string };
}

/** What every notification e-mail ends with: why it came, and a link that stops this kind without signing in. */
export interface NoticeFooter {
  unsubscribeHref: string;
  preferencesHref: string;
}

function noticeHtml(sections: NoticeSection[], footer: { text: string; link?: { href: string; label: string } }[]): string {
  const p = (t: string) => `<p style="margin:0 0 12px">${escapeHtml(t)}</p>`;
  const link = (l: { href: string; label: string }) => ` <a href="${escapeHtml(l.href)}" style="color:#9a4525;font-weight:600">${escapeHtml(l.label)}</a>`;
  const body = sections
    .map((s) => {
      const heading = s.heading ? `<h2 style="font-size:16px;margin:20px 0 8px">${escapeHtml(s.heading)}</h2>` : '';
      const subheading = s.subheading ? `<h3 style="font-size:14px;margin:12px 0 6px">${escapeHtml(s.subheading)}</h3>` : '';
      const paragraphs = (s.paragraphs ?? []).map(p).join('');
      const items = s.items?.length ? `<ul style="margin:0 0 12px;padding-left:20px">${s.items.map((i) => `<li style="margin:0 0 6px">${escapeHtml(i.text)}${i.link ? link(i.link) : ''}</li>`).join('')}</ul>` : '';
      const closing = s.link ? `<p style="margin:0 0 12px">${escapeHtml(s.link.text)}${link(s.link)}</p>` : '';
      return heading + subheading + paragraphs + items + closing;
    })
    .join('');
  const foot = footer
    .map((f) => `<p style="margin:0 0 6px;font-size:12px;color:#5f5448">${escapeHtml(f.text)}${f.link ? `${f.text ? ' ' : ''}<a href="${escapeHtml(f.link.href)}" style="color:#5f5448">${escapeHtml(f.link.label)}</a>` : ''}</p>`)
    .join('');
  return `<!doctype html><html><body style="font-family:'IBM Plex Sans',Arial,sans-serif;color:#2b241d;background:#fdfaf5;padding:24px"><div style="max-width:560px;margin:auto;background:#fff;border:1px solid #ede1cd;border-radius:12px;padding:24px"><p style="font-weight:600;color:#9a4525">Seepwise</p>${body}<hr style="border:none;border-top:1px solid #ede1cd;margin:20px 0 12px">${foot}</div></body></html>`;
}

function buildNotice(lang: Lang, subject: string, sections: NoticeSection[], footer: NoticeFooter, why: string): MailContent {
  const stop = lang === 'es' ? 'Dejar de recibir estos correos' : 'Stop these e-mails';
  const choose = lang === 'es' ? 'Elegir qué te envía Seepwise' : 'Choose what Seepwise e-mails you';
  const text = [
    ...sections.map((s) =>
      [
        s.heading ? s.heading.toUpperCase() : null,
        s.subheading ? `${s.subheading}:` : null,
        ...(s.paragraphs ?? []),
        (s.items ?? []).map((i) => `- ${i.text}${i.link ? `\n  ${i.link.label}: ${i.link.href}` : ''}`).join('\n') || null,
        s.link ? `${s.link.text} ${s.link.href}` : null,
      ]
        .filter((l): l is string => l !== null)
        .join('\n\n'),
    ),
    '—',
    why,
    `${stop}: ${footer.unsubscribeHref}`,
    `${choose}: ${footer.preferencesHref}`,
  ].join('\n\n');
  const html = noticeHtml(sections, [
    { text: why },
    { text: '', link: { href: footer.unsubscribeHref, label: stop } },
    { text: '', link: { href: footer.preferencesHref, label: choose } },
  ]);
  return { subject, text, html };
}

/** A calendar date (YYYY-MM-DD) as "3 June" / "3 de junio". */
export function formatDay(lang: Lang, isoDate: string): string {
  const d = new Date(`${isoDate}T12:00:00Z`);
  if (Number.isNaN(d.getTime())) return isoDate;
  return new Intl.DateTimeFormat(lang === 'es' ? 'es' : 'en-GB', { day: 'numeric', month: 'long', timeZone: 'UTC' }).format(d);
}

/** The UTC day of an instant, with its year: "16 December 2026" / "16 de diciembre de 2026" (days are UTC days, DEVELOPERS.md). */
export function formatInstantDay(lang: Lang, at: Date): string {
  return new Intl.DateTimeFormat(lang === 'es' ? 'es' : 'en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' }).format(at);
}

function formatNumber(lang: Lang, value: number, digits: number): string {
  return new Intl.NumberFormat(lang === 'es' ? 'es' : 'en-GB', { maximumFractionDigits: digits, minimumFractionDigits: digits }).format(value);
}

function volume(lang: Lang, units: UnitSystem, litres: number): string {
  return `${formatNumber(lang, toDisplay(litres, 'volume', units), 1)} ${unitLabel('volume', units)}`;
}

function temperature(lang: Lang, units: UnitSystem, celsius: number): string {
  return `${formatNumber(lang, toDisplay(celsius, 'temperature', units), 1)} ${unitLabel('temperature', units)}`;
}

export interface RefillMailPot {
  potLabel: string;
  trialTitle: string;
  gardenName: string;
  levelPct: number;
  levelL: number;
  /** The garden's date the pot runs dry (past when already empty); null when it never does at the current draw. */
  dryOn: string | null;
  dry: boolean;
  basis: 'seep-test' | 'crop-need';
  /** Opens the Round with the pot, to log the refill. */
  loggedHref: string;
}

export interface FrostMailGarden {
  gardenName: string;
  potsInGround: number;
  nights: { day: string; tMinC: number; forecast: boolean }[];
}

export interface DigestMailCohort {
  cohortName: string;
  href: string;
  trialsShared: number;
  /** Shared trials with entries logged in the last 7 days, and how many. */
  active: { label: string; entries: number }[];
  /** Active shared trials with nothing logged for 7 days. */
  quiet: { label: string; lastLogOn: string | null }[];
  /** Quality flags raised since the last digest (the cohort Results' flags; `message` is English). */
  newFlags: { label: string; kind: QualityFlag['kind']; message: string }[];
}

const flagTextEs: Record<QualityFlag['kind'], string> = {
  'out-of-line': 'un efecto muy alejado del de los demás ensayos del grupo',
  'wrong-unit': 'semanas cuyos litros por riego parecen una confusión entre galones y litros',
  'mixed-moisture-methods': 'humedad del suelo medida con más de un método, cuyas escalas no se pueden comparar',
  'closed-without-harvest': 'cerrado sin ningún registro de cosecha',
};

export const notificationTemplates = {
  refillReminder(lang: Lang, units: UnitSystem, name: string, thresholdPct: number, pots: RefillMailPot[], footer: NoticeFooter): MailContent {
    const n = pots.length;
    const es = lang === 'es';
    const items = pots.map((p) => {
      const where = `${p.potLabel} — ${p.trialTitle} (${p.gardenName})`;
      const left = `${formatNumber(lang, p.levelPct, 0)} %, ${volume(lang, units, p.levelL)}`;
      let text: string;
      if (p.dry) {
        const since = p.dryOn ? (es ? ` desde el ${formatDay(lang, p.dryOn)}` : ` since ${formatDay(lang, p.dryOn)}`) : '';
        text = es ? `${where}: probablemente vacía${since}.` : `${where}: probably empty${since}.`;
      } else {
        const when = p.dryOn ? (es ? `; vacía hacia el ${formatDay(lang, p.dryOn)}` : `; dry around ${formatDay(lang, p.dryOn)}`) : '';
        text = es ? `${where}: quedan unos ${left}${when}.` : `${where}: about ${left} left${when}.`;
      }
      return { text, link: { href: p.loggedHref, label: es ? '¿La rellenaste? Regístralo' : 'Refilled it? Log it' } };
    });
    const measured = pots.every((p) => p.basis === 'seep-test');
    const how = es
      ? `La estimación parte de tu último relleno registrado y resta lo que ${measured ? 'la olla filtró en su prueba de filtración' : 'filtra la olla (su prueba de filtración, o la necesidad de agua del cultivo si aún no tiene una)'}. El calor, la lluvia y el suelo cambian el ritmo real: mira antes de echar agua.`
      : `The estimate starts from your last logged refill and takes off what ${measured ? 'the pot lost in its seep test' : 'the pot draws (its seep test, or the crop’s water need before it has one)'} each day. Heat, rain and soil change the real rate, so look before you pour.`;
    return buildNotice(
      lang,
      es ? (n === 1 ? 'Recordatorio: 1 olla se está quedando sin agua' : `Recordatorio: ${n} ollas se están quedando sin agua`) : n === 1 ? 'Refill reminder: 1 pot is running low' : `Refill reminder: ${n} pots are running low`,
      [
        {
          paragraphs: [
            es ? `Hola, ${name}:` : `Hello ${name},`,
            es ? `Según nuestra estimación, ${n === 1 ? 'esta olla está' : 'estas ollas están'} por debajo de tu nivel de aviso (${thresholdPct} % de su capacidad):` : `By Seepwise's estimate, ${n === 1 ? 'this pot is' : 'these pots are'} below your reminder level (${thresholdPct} % of capacity):`,
          ],
          items,
        },
        { paragraphs: [how] },
      ],
      footer,
      es ? 'Recibes este correo porque tienes activados los recordatorios de relleno. Como mucho llega uno al día por olla.' : 'You get this e-mail because refill reminders are on in your account. At most one comes per pot per day.',
    );
  },

  frostWarning(lang: Lang, units: UnitSystem, name: string, gardens: FrostMailGarden[], frost: { body: string; defersTo: string }, footer: NoticeFooter): MailContent {
    const es = lang === 'es';
    const items = gardens.map((g) => {
      const nights = g.nights
        .map((night) =>
          es
            ? `${temperature(lang, units, night.tMinC)} ${night.forecast ? 'pronosticados' : 'registrados'} el ${formatDay(lang, night.day)}`
            : `${temperature(lang, units, night.tMinC)} ${night.forecast ? 'forecast' : 'logged'} for ${formatDay(lang, night.day)}`,
        )
        .join('; ');
      const pots = es ? (g.potsInGround === 1 ? '1 olla enterrada' : `${g.potsInGround} ollas enterradas`) : g.potsInGround === 1 ? '1 pot in the ground' : `${g.potsInGround} pots in the ground`;
      return { text: `${g.gardenName} (${pots}): ${nights}.` };
    });
    return buildNotice(
      lang,
      es ? 'Aviso de helada: vacía o saca tus ollas' : 'Frost warning: empty or lift your pots',
      [
        {
          paragraphs: [
            es ? `Hola, ${name}:` : `Hello ${name},`,
            es ? `Hay mínimas de ${temperature(lang, units, 0)} o menos, registradas o pronosticadas, en:` : `A minimum of ${temperature(lang, units, 0)} or below is logged or forecast at:`,
          ],
          items,
        },
        { paragraphs: [es ? 'Vacía las ollas o sácalas de la tierra antes de esa noche.' : 'Empty the pots, or lift them out of the ground, before that night.', frost.body, frost.defersTo] },
      ],
      footer,
      es ? 'Recibes este correo porque tienes activados los avisos de helada. Llega uno por huerto y noche de helada.' : 'You get this e-mail because frost warnings are on in your account. One comes per garden and frost night.',
    );
  },

  weeklyDigest(lang: Lang, name: string, upTo: string, cohorts: DigestMailCohort[], footer: NoticeFooter): MailContent {
    const es = lang === 'es';
    const entries = cohorts.reduce((s, c) => s + c.active.reduce((t, a) => t + a.entries, 0), 0);
    const sections: NoticeSection[] = [
      {
        paragraphs: [
          es ? `Hola, ${name}:` : `Hello ${name},`,
          es ? `Esto pasó en los ensayos compartidos de tus grupos en los 7 días hasta el ${formatDay(lang, upTo)}.` : `Here is what happened in your cohorts' shared trials in the 7 days to ${formatDay(lang, upTo)}.`,
        ],
      },
    ];
    for (const c of cohorts) {
      sections.push({
        heading: c.cohortName,
        paragraphs: [es ? `${c.trialsShared} ensayo${c.trialsShared === 1 ? '' : 's'} compartido${c.trialsShared === 1 ? '' : 's'}.` : `${c.trialsShared} shared trial${c.trialsShared === 1 ? '' : 's'}.`],
      });
      sections.push({
        subheading: es ? 'Registros nuevos' : 'New entries',
        ...(c.active.length
          ? { items: c.active.map((a) => ({ text: es ? `${a.label}: ${a.entries} registro${a.entries === 1 ? '' : 's'} nuevo${a.entries === 1 ? '' : 's'}` : `${a.label}: ${a.entries} new entr${a.entries === 1 ? 'y' : 'ies'}` })) }
          : { paragraphs: [es ? 'Ningún ensayo compartido tiene registros nuevos.' : 'No shared trial has new entries.'] }),
      });
      if (c.quiet.length) {
        sections.push({
          subheading: es ? 'Sin actividad en 7 días' : 'Quiet for 7 days',
          items: c.quiet.map((q) => ({
            text: q.lastLogOn ? (es ? `${q.label}: último registro el ${formatDay(lang, q.lastLogOn)}` : `${q.label}: last entry on ${formatDay(lang, q.lastLogOn)}`) : es ? `${q.label}: sin registros todavía` : `${q.label}: nothing logged yet`,
          })),
        });
      }
      if (c.newFlags.length) {
        sections.push({ subheading: es ? 'Avisos de calidad nuevos' : 'New quality flags', items: c.newFlags.map((f) => ({ text: `${f.label}: ${es ? flagTextEs[f.kind] : f.message}` })) });
      }
      sections.push({ link: { text: es ? 'Abrir el grupo:' : 'Open the cohort:', href: c.href, label: c.cohortName } });
    }
    return buildNotice(
      lang,
      es ? `Resumen semanal de Seepwise: ${entries} registro${entries === 1 ? '' : 's'} nuevo${entries === 1 ? '' : 's'}` : `Seepwise weekly digest: ${entries} new entr${entries === 1 ? 'y' : 'ies'} in your cohorts`,
      sections,
      footer,
      es ? 'Recibes este correo porque coordinas un grupo y tienes activado el resumen semanal.' : 'You get this e-mail because you lead a cohort and the weekly digest is on in your account.',
    );
  },
};
