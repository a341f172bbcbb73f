import type { OutgoingMail } from './mailer.js';
import { plainName } from './plain-name.js';

export function invitationMail(p: { to: string; organisationName: string; inviterName: string; role: string; link: string; expiresAt: Date }): OutgoingMail {
  const organisation = plainName(p.organisationName, 'an organisation');
  const inviter = plainName(p.inviterName, 'A colleague');
  return {
    to: p.to,
    subject: `${inviter} invited you to ${organisation} on Cleancase`,
    text: [
      `${inviter} invited you to join ${organisation} on Cleancase as ${p.role}.`,
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

/** Sent instead of creating a second account when someone signs up with an address that has one. */
export function accountExistsMail(p: { to: string; signInLink: string; resetLink: string }): OutgoingMail {
  return {
    to: p.to,
    subject: 'Your Cleancase account already exists',
    text: [
      'Someone tried to create a Cleancase account with this e-mail address, which already has one. No second account was made.',
      '',
      `If it was you, sign in: ${p.signInLink}`,
      `Forgot the password? Ask for a reset link: ${p.resetLink}`,
      '',
      'If it was not you, ignore this message; nothing about your account changed.',
    ].join('\n'),
  };
}

/** Sent after self sign-up: following the link proves the person receives mail at the address. */
export function addressConfirmationMail(p: { to: string; link: string; expiresAt: Date }): OutgoingMail {
  return {
    to: p.to,
    subject: 'Confirm your e-mail address for Cleancase',
    text: [
      'A Cleancase account was made with this e-mail address. Confirm that the address is yours:',
      '',
      p.link,
      '',
      `The link works once and until ${p.expiresAt.toUTCString()}. If you did not make the account, ignore this message.`,
    ].join('\n'),
  };
}

/** To each approver and administrator who sees the unit, when a cleaning case is submitted for a decision. */
export function caseSubmittedMail(p: {
  to: string;
  caseTitle: string;
  unitName: string;
  plantName: string;
  submitterName: string;
  link: string;
}): OutgoingMail {
  const title = plainName(p.caseTitle, 'A cleaning case', 120);
  const submitter = plainName(p.submitterName, 'A colleague');
  const where = `${plainName(p.unitName, 'a unit')} at ${plainName(p.plantName, 'a plant')}`;
  return {
    to: p.to,
    subject: `Cleaning case for your decision: ${title}`,
    text: [`${submitter} submitted the cleaning case “${title}” for ${where}. Approve it or send it back with a reason:`, '', p.link].join('\n'),
  };
}

/** To the author of a cleaning case, when an approver approves it or sends it back (with the reason). */
export function caseDecidedMail(p: {
  to: string;
  caseTitle: string;
  decision: 'approved' | 'returned';
  deciderName: string;
  reason: string | null;
  link: string;
}): OutgoingMail {
  const title = plainName(p.caseTitle, 'Your cleaning case', 120);
  const decider = plainName(p.deciderName, 'An approver');
  const approved = p.decision === 'approved';
  return {
    to: p.to,
    subject: approved ? `Cleaning case approved: ${title}` : `Cleaning case sent back: ${title}`,
    text: [
      approved ? `${decider} approved your cleaning case “${title}”.` : `${decider} sent your cleaning case “${title}” back.`,
      ...(approved ? [] : ['', `Reason: ${plainName(p.reason ?? '', '(none given)', 2000)}`]),
      '',
      approved ? `The case: ${p.link}` : `Change it and submit it again: ${p.link}`,
    ].join('\n'),
  };
}

/** To each administrator, a few days before a trial without a plan ends. */
export function trialEndingMail(p: { to: string; organisationName: string; endsOn: string; link: string }): OutgoingMail {
  const organisation = plainName(p.organisationName, 'Your organisation');
  return {
    to: p.to,
    subject: `The Cleancase trial of ${organisation} ends on ${p.endsOn}`,
    text: [
      `The trial of ${organisation} ends on ${p.endsOn}. After that the organisation can still be read and downloaded, but nothing can be changed until a plan is chosen.`,
      '',
      `Choose a plan: ${p.link}`,
      '',
      'Nothing is deleted when a trial ends.',
    ].join('\n'),
  };
}

/** To each administrator, when Stripe could not take a payment. */
export function paymentFailedMail(p: { to: string; organisationName: string; amount: string; graceDays: number; link: string }): OutgoingMail {
  const organisation = plainName(p.organisationName, 'Your organisation');
  return {
    to: p.to,
    subject: `Payment for ${organisation} on Cleancase did not go through`,
    text: [
      `The payment of ${p.amount} for ${organisation} did not go through. Stripe tries again over the next days.`,
      `If it is still unpaid after ${p.graceDays} days, the organisation becomes read-only (nothing is deleted) until it is paid.`,
      '',
      `Update the card or pay the invoice: ${p.link}`,
    ].join('\n'),
  };
}

/** To each administrator, for every paid invoice. */
export function receiptMail(p: {
  to: string;
  organisationName: string;
  amount: string;
  number: string;
  invoiceUrl: string | null;
  link: string;
}): OutgoingMail {
  const organisation = plainName(p.organisationName, 'Your organisation');
  return {
    to: p.to,
    subject: `Receipt ${p.number} for ${organisation} on Cleancase`,
    text: [
      `Thank you: ${p.amount} for ${organisation} was paid (invoice ${p.number}).`,
      ...(p.invoiceUrl ? ['', `The invoice: ${p.invoiceUrl}`] : []),
      '',
      `Billing: ${p.link}`,
    ].join('\n'),
  };
}
