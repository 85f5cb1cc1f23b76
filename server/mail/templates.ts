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
  cohortInvitation(lang: Lang, cohortName: string, role: 'contributor' | 'observer', href: string): MailContent {
    const roleEn = role === 'contributor' ? 'a contributor (you share your own trials)' : 'an observer (you read and export the pooled data)';
    const roleEs = role === 'contributor' ? 'colaborador (compartes tus propios ensayos)' : 'observador (lees y exportas los datos agrupados)';
    return lang === 'es'
      ? build(`Invitación a «${cohortName}» en Seepwise`, [`Te han invitado a unirte a «${cohortName}» como ${roleEs}.`, 'Los demás miembros te verán con un seudónimo, nunca con tu nombre. La invitación caduca en 14 días.'], { href, label: 'Ver la invitación' })
      : build(`You are invited to "${cohortName}" on Seepwise`, [`You have been invited to join "${cohortName}" as ${roleEn}.`, 'Other members see you under a pseudonym, never your name. The invitation expires in 14 days.'], { href, label: 'Open the invitation' });
  },
};
