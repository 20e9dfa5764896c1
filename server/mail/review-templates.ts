/** Texts of the review mails: review requested, changes requested, approved, released. */
import type { MailMessage } from './mailer.ts';
import { layout } from './templates.ts';

interface Common { to: string; patternTitle: string; link: string }

function message(o: Common, subject: string, lines: string[], linkLabel: string, footer: string): MailMessage {
  return { to: o.to, subject, text: `${lines.join('\n\n')}\n\n${o.link}\n\n${footer}\n`, html: layout(lines, o.link, linkLabel, footer) };
}

const FOOTER = 'You get this mail because you work on this pattern on Loopwright.';

/** To an editor: the designer asks for a review of a revision. */
export function reviewRequestedMail(o: Common & { designer: string; revision: number; note: string | null }): MailMessage {
  const lines = [`${o.designer} asks you to review revision ${o.revision} of "${o.patternTitle}".`];
  if (o.note) lines.push(`Their note: ${o.note}`);
  lines.push('Open the pattern to see the changes round by round, comment on rounds, and approve or ask for changes.');
  return message(o, `Review requested: "${o.patternTitle}", revision ${o.revision}`, lines, 'Open the review', FOOTER);
}

/** To the designer: the editor asks for changes. */
export function changesRequestedMail(o: Common & { editor: string; revision: number; note: string }): MailMessage {
  const lines = [`${o.editor} asks for changes to revision ${o.revision} of "${o.patternTitle}".`, `Their message: ${o.note}`, 'Save a new revision and ask for a review again when it is ready.'];
  return message(o, `Changes requested: "${o.patternTitle}"`, lines, 'Open the pattern', FOOTER);
}

/** To the designer: the editor approved a revision. */
export function approvedMail(o: Common & { editor: string; revision: number; note: string | null }): MailMessage {
  const lines = [`${o.editor} approved revision ${o.revision} of "${o.patternTitle}".`];
  if (o.note) lines.push(`Their message: ${o.note}`);
  lines.push('You can now release it with a version label.');
  return message(o, `Approved: "${o.patternTitle}", revision ${o.revision}`, lines, 'Open the pattern', FOOTER);
}

/** To every member: a version was released. */
export function releasedMail(o: Common & { designer: string; label: string; notes: string }): MailMessage {
  const lines = [`${o.designer} released version ${o.label} of "${o.patternTitle}".`];
  if (o.notes) lines.push(`Release notes: ${o.notes}`);
  lines.push('Open it to choose your size, follow the chart and the written instructions, and keep your place.');
  return message(o, `Released: "${o.patternTitle}" ${o.label}`, lines, `Open version ${o.label}`, FOOTER);
}

/** To the designer: a knitter reported an erratum on a round of a release. */
export function erratumMail(o: Common & { reporter: string; label: string; round: number; size: string | null; body: string }): MailMessage {
  const where = `round ${o.round}${o.size ? ` (size ${o.size})` : ''}`;
  const lines = [`${o.reporter} reported an erratum on ${where} of "${o.patternTitle}" ${o.label}.`, o.body, 'It is a comment on that revision now; answer or resolve it there.'];
  return message(o, `Erratum reported: "${o.patternTitle}" ${o.label}, ${where}`, lines, 'Open the comment', FOOTER);
}
