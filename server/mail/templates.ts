import type { MailMessage } from './mailer.ts';

export function invitationMail(to: string, name: string, inviter: string, link: string): MailMessage {
  return {
    to,
    subject: 'You are invited to Meltwire',
    text: [
      `Hello ${name},`,
      '',
      `${inviter} has invited you to Meltwire, the chemistry results hub of your laboratory.`,
      'Choose a password to activate your account (the link is valid for 7 days):',
      '',
      link,
      '',
      'If you did not expect this invitation, ignore this message.',
    ].join('\n'),
  };
}

export function passwordResetMail(to: string, link: string): MailMessage {
  return {
    to,
    subject: 'Reset your Meltwire password',
    text: [
      'Someone asked to reset the password of this Meltwire account.',
      'Choose a new password with this link (valid for 60 minutes):',
      '',
      link,
      '',
      'If it was not you, ignore this message; your password stays as it is.',
    ].join('\n'),
  };
}
