/**
 * The words of the account e-mails. Pure: the caller passes names, the link and the expiry,
 * so the text is tested without sending anything and without a clock.
 */
import { isoDay, shortDate } from '../../shared/rules/dates.js';
import type { Role } from '../../shared/schemas/auth.js';

export interface MessageText {
  subject: string;
  text: string;
}

const ROLE_DUTIES: Record<Role, string> = {
  owner: 'an owner: you can do everything, including inviting members and changing the organisation settings',
  electrician: 'an electrician: you can create, edit and print board schedules',
  viewer: 'a viewer: you can read and print board schedules, but not change them',
};

/** "8 Mar 2025, 14:05 UTC": the app's short date, and a time zone so no reader misreads the hour. */
export function formatUtc(when: Date): string {
  return `${shortDate(isoDay(when))}, ${when.toISOString().slice(11, 16)} UTC`;
}

export interface InvitationMessageInput {
  organisationName: string;
  inviterName: string;
  role: Role;
  link: string;
  expiresAt: Date;
}

/** The invitation a new member receives: who asked, which role, the one-time link and when it lapses. */
export function invitationMessage(input: InvitationMessageInput): MessageText {
  return {
    subject: `${input.inviterName} has invited you to ${input.organisationName} on Waymark`,
    text: [
      'Hello,',
      '',
      `${input.inviterName} has invited you to join ${input.organisationName} on Waymark as ${ROLE_DUTIES[input.role]}.`,
      '',
      'To join, open this link and choose your name and a password:',
      input.link,
      '',
      `The link can be used once and stops working at ${formatUtc(input.expiresAt)}.`,
      'If you were not expecting this, you can ignore this e-mail: no account is made unless the link is used.',
      '',
      '— Waymark',
    ].join('\n'),
  };
}

export interface PasswordResetMessageInput {
  name: string;
  email: string;
  link: string;
  expiresAt: Date;
}

/** The password reset link. Says plainly that ignoring it changes nothing. */
export function passwordResetMessage(input: PasswordResetMessageInput): MessageText {
  return {
    subject: 'Choose a new Waymark password',
    text: [
      `Hello ${input.name},`,
      '',
      `We were asked to reset the password of the Waymark account ${input.email}.`,
      'To choose a new password, open this link:',
      input.link,
      '',
      `The link can be used once and stops working at ${formatUtc(input.expiresAt)}.`,
      'Setting a new password signs the account out on every other device.',
      'If you did not ask for this, ignore this e-mail: your password stays as it is.',
      '',
      '— Waymark',
    ].join('\n'),
  };
}

export interface SignupLinkMessageInput {
  name: string;
  organisationName: string;
  link: string;
  expiresAt: Date;
}

/** The link that finishes a sign-up: the account exists only once it is opened. */
export function signupLinkMessage(input: SignupLinkMessageInput): MessageText {
  return {
    subject: 'Finish opening your Waymark account',
    text: [
      `Hello ${input.name},`,
      '',
      `To finish opening the Waymark account for ${input.organisationName}, open this link:`,
      input.link,
      '',
      `The link can be used once and stops working at ${formatUtc(input.expiresAt)}.`,
      'If you did not sign up, ignore this e-mail: no account is made unless the link is used.',
      '',
      '— Waymark',
    ].join('\n'),
  };
}

export interface AlreadyRegisteredMessageInput {
  name: string;
  email: string;
  link: string;
  because: 'signup' | 'invitation';
  organisationName?: string;
}

/**
 * Sent instead of a link when the address already has an account: the answer on screen is the same
 * as for a new address (it must not tell a stranger who has an account), so the owner of the address hears it here.
 */
export function alreadyRegisteredMessage(input: AlreadyRegisteredMessageInput): MessageText {
  const what =
    input.because === 'signup'
      ? `Someone asked to open a new Waymark account with this address (${input.email}).`
      : `${input.organisationName ?? 'An organisation'} invited this address (${input.email}) to join them on Waymark.`;
  return {
    subject: input.because === 'signup' ? 'Your address already has a Waymark account' : 'An invitation to an address that already has a Waymark account',
    text: [
      `Hello ${input.name},`,
      '',
      what,
      'This address already has an account, and an address can belong to one organisation only, so nothing was changed.',
      '',
      'If it was you and you have forgotten the password, choose a new one here:',
      input.link,
      input.because === 'invitation'
        ? 'To join the other organisation, ask them to invite a different address.'
        : 'If it was not you, you can ignore this e-mail.',
      '',
      '— Waymark',
    ].join('\n'),
  };
}
