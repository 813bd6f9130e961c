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

/** One message for a user's grouped alerts, each with what happened and a link to it. */
export function alertsMail(to: string, alerts: { subject: string; body: string; link: string; at: string }[]): MailMessage {
  const subject =
    alerts.length === 1 ? `Meltwire alert: ${alerts[0].subject}` : `Meltwire: ${alerts.length} alerts, first: ${alerts[0].subject}`;
  return {
    to,
    subject,
    text: [
      ...alerts.flatMap((a) => [`${a.subject} (${a.at})`, a.body, `Open: ${a.link}`, '']),
      "Check the affected results under your laboratory's procedures before releasing them.",
      'Choose which events e-mail you on your own page in the Meltwire console.',
    ].join('\n'),
  };
}
