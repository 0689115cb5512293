import type { MailMessage } from './mailer';

// Every message is plain text only: no HTML part, so nothing a user typed (a team or person's
// name) can become markup or a link target. Names users chose are shown quoted, on one line,
// shortened, and subjects never carry them.

/** A name someone typed, safe to show inside a plain-text message. */
function quotedName(name: string): string {
  const oneLine = name
    .replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029]+/g, ' ')
    .replace(/\s+/g, ' ')
    .trim();
  return `"${oneLine.length > 80 ? `${oneLine.slice(0, 79)}…` : oneLine}"`;
}

function message(to: string, subject: string, paragraphs: string[]): MailMessage {
  return { to, subject, text: `${paragraphs.join('\n\n')}\n\n-- \nSpoolbook\n` };
}

export function passwordResetMail(to: string, link: string, validMinutes: number): MailMessage {
  return message(to, 'Reset your Spoolbook password', [
    'Someone asked to reset the password of your Spoolbook account.',
    `Open this link within ${validMinutes} minutes to choose a new password. It works once, and only the newest link you were sent works.`,
    link,
    'If it was not you, ignore this message: your password stays as it is.',
  ]);
}

export function invitationMail(to: string, link: string, teamName: string, inviterName: string, role: string, validDays: number): MailMessage {
  return message(to, 'An invitation to a team on Spoolbook', [
    `${quotedName(inviterName)} invited you to join a team on Spoolbook as ${role}. The team is called ${quotedName(teamName)} (a name its owners chose).`,
    `Open this link within ${validDays} days to join. You can sign up there if you have no account yet.`,
    link,
    'If you do not know the sender, ignore this message.',
  ]);
}

export function emailConfirmationMail(to: string, link: string, validHours: number): MailMessage {
  return message(to, 'Confirm your e-mail address for Spoolbook', [
    'Someone made a Spoolbook account with this address.',
    `Open this link within ${validHours} hours to confirm it is yours. Until then the account can work only in its personal team.`,
    link,
    'If it was not you, ignore this message.',
  ]);
}

export function firstAdminMail(to: string, link: string, validMinutes: number): MailMessage {
  return message(to, 'Your Spoolbook site admin account', [
    'A Spoolbook site admin account was made for this address.',
    `Open this link within ${validMinutes} minutes to choose its password. It works once.`,
    link,
  ]);
}
