import type { OutgoingMail } from './mailer.js';

export function invitationMail(p: { to: string; organisationName: string; inviterName: string; role: string; link: string; expiresAt: Date }): OutgoingMail {
  return {
    to: p.to,
    subject: `${p.inviterName} invited you to ${p.organisationName} on Cleancase`,
    text: [
      `${p.inviterName} invited you to join ${p.organisationName} on Cleancase as ${p.role}.`,
      '',
      `Accept the invitation: ${p.link}`,
      '',
      `The link works once and until ${p.expiresAt.toUTCString()}. If you did not expect it, ignore this message.`,
    ].join('\n'),
  };
}

export function passwordResetMail(p: { to: string; link: string; expiresAt: Date }): OutgoingMail {
  return {
    to: p.to,
    subject: 'Reset your Cleancase password',
    text: [
      'Someone asked to reset the password of this Cleancase account.',
      '',
      `Choose a new password: ${p.link}`,
      '',
      `The link works once and until ${p.expiresAt.toUTCString()}. If it was not you, ignore this message; your password stays as it is.`,
    ].join('\n'),
  };
}
