/** The text of every message we send, as plain text and HTML (all user text escaped). */
import type { MailMessage } from './mailer.js';

const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

const SIGN_OFF = 'Trestle — design checks are for review by a competent engineer.';

function html(paragraphs: string[], link?: { href: string; label: string }): string {
  const body = paragraphs.map((p) => `<p>${esc(p).replace(/\n/g, '<br>')}</p>`).join('\n');
  const button = link ? `\n<p><a href="${esc(link.href)}">${esc(link.label)}</a></p>` : '';
  return `<!doctype html>\n<html><body style="font-family: sans-serif">\n${body}${button}\n<p style="color:#666">${esc(SIGN_OFF)}</p>\n</body></html>`;
}

function text(paragraphs: string[], link?: string): string {
  return [...paragraphs, ...(link ? [link] : []), '--', SIGN_OFF].join('\n\n');
}

export function inviteMessage(to: string, name: string, invitedBy: string, link: string, hours: number): MailMessage {
  const p = [`Hello ${name},`, `${invitedBy} has invited you to Trestle. Choose a password to sign in; the link works for ${hours} hours.`];
  return { to, kind: 'invite', subject: 'You are invited to Trestle', text: text(p, link), html: html(p, { href: link, label: 'Choose your password' }) };
}

export function resetMessage(to: string, name: string, link: string, minutes: number): MailMessage {
  const p = [
    `Hello ${name},`,
    `Someone asked to reset the password of your Trestle account. The link below works once, for ${minutes} minutes. If it was not you, ignore this message; your password stays as it is.`,
  ];
  return { to, kind: 'reset', subject: 'Reset your Trestle password', text: text(p, link), html: html(p, { href: link, label: 'Choose a new password' }) };
}

export interface RunMailFacts {
  runId: number;
  projectName: string;
  modelName: string;
  version: number;
  actorName: string;
  message: string;
  link: string;
}

export function submittedMessage(to: string[], f: RunMailFacts): MailMessage {
  const p = [
    `${f.actorName} submitted run ${f.runId} of ${f.modelName} (version ${f.version}) in ${f.projectName} for review.`,
    `Message: ${f.message}`,
  ];
  return { to, kind: 'submitted', subject: `Review requested: run ${f.runId} of ${f.modelName}`, text: text(p, f.link), html: html(p, { href: f.link, label: 'Open the run' }) };
}

export function returnedMessage(to: string, f: RunMailFacts): MailMessage {
  const p = [`${f.actorName} returned run ${f.runId} of ${f.modelName} (version ${f.version}) in ${f.projectName} with comments.`, `Comments: ${f.message}`];
  return { to, kind: 'returned', subject: `Returned: run ${f.runId} of ${f.modelName}`, text: text(p, f.link), html: html(p, { href: f.link, label: 'Open the run' }) };
}

export function approvedMessage(to: string, f: RunMailFacts): MailMessage {
  const p = [
    `${f.actorName} approved run ${f.runId} of ${f.modelName} (version ${f.version}) in ${f.projectName}. That version is now locked.`,
    ...(f.message ? [`Message: ${f.message}`] : []),
  ];
  return { to, kind: 'approved', subject: `Approved: run ${f.runId} of ${f.modelName}`, text: text(p, f.link), html: html(p, { href: f.link, label: 'Open the run' }) };
}
