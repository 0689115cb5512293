import type { MailMessage } from './mailer';

function escapeHtml(s: string) {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

function layout(paragraphs: string[], link: { href: string; label: string }) {
  const body = paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join('\n');
  return `<div style="font-family:sans-serif;color:#2b2b2b;background:#f7f3ea;padding:24px">
<h2 style="color:#0f766e;margin-top:0">Spoolbook</h2>
${body}
<p><a href="${escapeHtml(link.href)}" style="color:#0f766e">${escapeHtml(link.label)}</a></p>
</div>`;
}

export function passwordResetMail(to: string, link: string, validMinutes: number): MailMessage {
  const lines = [
    'Someone asked to reset the password of your Spoolbook account.',
    `Open this link within ${validMinutes} minutes to choose a new password. It works once.`,
    'If it was not you, ignore this message: your password stays as it is.',
  ];
  return {
    to,
    subject: 'Reset your Spoolbook password',
    text: `${lines[0]}\n\n${lines[1]}\n\n${link}\n\n${lines[2]}\n`,
    html: layout(lines, { href: link, label: 'Choose a new password' }),
  };
}

export function invitationMail(to: string, link: string, teamName: string, inviterName: string, role: string, validDays: number): MailMessage {
  const lines = [
    `${inviterName} invited you to join the team "${teamName}" on Spoolbook as ${role}.`,
    `Open this link within ${validDays} days to join. You can sign up there if you have no account yet.`,
  ];
  return {
    to,
    subject: `Join ${teamName} on Spoolbook`,
    text: `${lines[0]}\n\n${lines[1]}\n\n${link}\n`,
    html: layout(lines, { href: link, label: `Join ${teamName}` }),
  };
}
