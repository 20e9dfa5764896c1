/** Texts of the mails we send, in plain text and simple HTML. */
import type { MailMessage } from './mailer.ts';

/** Escapes text for HTML element content and attribute values. */
export const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);

const roleWords: Record<string, string> = {
  editor: 'technical editor',
  'test-knitter': 'test knitter',
  knitter: 'knitter',
};

/** The common mail body: paragraphs, one link, a footer. */
export function layout(paragraphs: string[], link: string, linkLabel: string, footer: string): string {
  const ps = paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join('\n');
  return `<!doctype html><html><body style="font-family:sans-serif;max-width:36em;line-height:1.5">
${ps}
<p><a href="${escapeHtml(link)}">${escapeHtml(linkLabel)}</a></p>
<p style="color:#666;font-size:90%">${escapeHtml(footer)}</p>
</body></html>`;
}

/** Invitation to join a pattern as editor, test knitter or knitter. */
export function invitationMail(o: { to: string; inviter: string; patternTitle: string; role: string; link: string; expiresAt: Date }): MailMessage {
  const role = roleWords[o.role] ?? o.role;
  const lines = [
    `${o.inviter} has asked you to join "${o.patternTitle}" on Loopwright as ${role}.`,
    'Open the link below to accept. If you have no Loopwright account yet, you can choose a name and password there.',
  ];
  const footer = `The link works once and until ${o.expiresAt.toUTCString()}. If you were not expecting this, you can ignore this message.`;
  return {
    to: o.to,
    subject: `You are invited to "${o.patternTitle}" on Loopwright`,
    text: `${lines.join('\n\n')}\n\n${o.link}\n\n${footer}\n`,
    html: layout(lines, o.link, 'Accept the invitation', footer),
  };
}

/** Password reset link. */
export function passwordResetMail(o: { to: string; name: string; link: string; expiresAt: Date }): MailMessage {
  const lines = [`Hello ${o.name},`, 'Someone (hopefully you) asked to choose a new password for this Loopwright account. Open the link below to set one.'];
  const footer = `The link works once and until ${o.expiresAt.toUTCString()}. If you did not ask for this, ignore this message; your password stays as it is.`;
  return {
    to: o.to,
    subject: 'Choose a new Loopwright password',
    text: `${lines.join('\n\n')}\n\n${o.link}\n\n${footer}\n`,
    html: layout(lines, o.link, 'Choose a new password', footer),
  };
}

/**
 * Notice that an account's password was changed (in the account settings or
 * with a reset link), sent to the account's address so its owner learns of
 * a change they did not make. Carries no secret: the link opens the page
 * that asks for a fresh reset link.
 */
export function passwordChangedMail(o: { to: string; name: string; at: Date; how: 'settings' | 'reset'; resetPage: string }): MailMessage {
  const how = o.how === 'settings' ? 'in the account settings' : 'with a reset link sent to this address';
  const lines = [
    `Hello ${o.name},`,
    `The password of your Loopwright account (${o.to}) was changed ${how} on ${o.at.toUTCString()}. Every other signed-in session of the account has been signed out.`,
    'If that was you, there is nothing more to do. If it was not, ask for a reset link at once with the link below and choose a new password; it signs out everyone else, whoever changed it.',
  ];
  const footer = 'You get this message whenever the password of this account changes.';
  return {
    to: o.to,
    subject: 'Your Loopwright password was changed',
    text: `${lines.join('\n\n')}\n\n${o.resetPage}\n\n${footer}\n`,
    html: layout(lines, o.resetPage, 'Ask for a reset link', footer),
  };
}
