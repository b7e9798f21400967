import { escapeHtml } from '../html';
import type { OutgoingMail } from '../mail/mailer';

export interface InvitationEmailInput {
  to: string;
  projectTitle: string;
  inviter: string;
  role: string;
  link: string;
  expiresAt: Date;
}

const ROLE_TEXT: Record<string, string> = {
  viewer: 'view and solve it',
  editor: 'view, solve and edit it',
  owner: 'view, edit and manage it',
};

/** The invitation e-mail, as plain text and as simple HTML (user text escaped). */
export function invitationEmail(i: InvitationEmailInput): OutgoingMail {
  const when = i.expiresAt.toUTCString();
  const text = [
    `${i.inviter} invited you to the Tapline project "${i.projectTitle}" as ${i.role} (you will be able to ${ROLE_TEXT[i.role] ?? 'open it'}).`,
    '',
    `Accept the invitation: ${i.link}`,
    '',
    `The link works once and expires ${when}. If you did not expect this, ignore this message.`,
  ].join('\n');
  const html = `<p>${escapeHtml(i.inviter)} invited you to the Tapline project <strong>${escapeHtml(i.projectTitle)}</strong> as ${escapeHtml(i.role)}.</p>
<p><a href="${escapeHtml(i.link)}">Accept the invitation</a></p>
<p>The link works once and expires ${escapeHtml(when)}. If you did not expect this, ignore this message.</p>`;
  return { to: i.to, subject: `Invitation to "${i.projectTitle}" on Tapline`, text, html };
}
