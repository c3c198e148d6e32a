// The words of the account and class e-mails, built from plain values so they can be read and tested
// without sending anything. Plain text: it reads the same in every mail program.

export interface MailText {
  subject: string;
  text: string;
}

const SIGN_OFF = '— Benchwright';

function greeting(name: string | null | undefined): string {
  return name && name.trim() ? `Hello ${name.trim()},` : 'Hello,';
}

/** /sign-up with the class's join code and the invited address filled in. */
export function signUpLink(origin: string, joinCode: string, email: string): string {
  const url = new URL('/sign-up', origin);
  url.searchParams.set('code', joinCode);
  url.searchParams.set('email', email);
  return url.toString();
}

/** /reset-password carrying the one-time token. */
export function resetLink(origin: string, token: string): string {
  const url = new URL('/reset-password', origin);
  url.searchParams.set('token', token);
  return url.toString();
}

export function pageLink(origin: string, path: string): string {
  return new URL(path, origin).toString();
}

export interface ClassInvitationInput {
  className: string;
  instructorName: string;
  inviteeName?: string | null;
  joinCode: string;
  signUpUrl: string;
  signInUrl: string;
}

/** To an address with no account yet: a sign-up link that joins the class. */
export function classInvitationMail(input: ClassInvitationInput): MailText {
  return {
    subject: `You are invited to ${input.className} on Benchwright`,
    text: [
      greeting(input.inviteeName),
      '',
      `${input.instructorName} invited you to the class ${input.className} on Benchwright, where you rehearse repair procedures on a 3D model before the bench.`,
      '',
      'Create your account with this link; it puts you in the class:',
      input.signUpUrl,
      '',
      `Already have an account under another address? Sign in at ${input.signInUrl} and enter the join code ${input.joinCode}.`,
      '',
      'If you did not expect this invitation, you can ignore this e-mail.',
      '',
      SIGN_OFF,
    ].join('\n'),
  };
}

export interface AddedToClassInput {
  className: string;
  instructorName: string;
  learnerName: string;
  signInUrl: string;
  forgotPasswordUrl: string;
}

/** To a learner who already had an account and was put in the class. */
export function addedToClassMail(input: AddedToClassInput): MailText {
  return {
    subject: `You were added to ${input.className} on Benchwright`,
    text: [
      greeting(input.learnerName),
      '',
      `${input.instructorName} added you to the class ${input.className} on Benchwright. There is nothing to do: the class is on your page the next time you sign in.`,
      '',
      `Sign in: ${input.signInUrl}`,
      `Forgot your password? ${input.forgotPasswordUrl}`,
      '',
      SIGN_OFF,
    ].join('\n'),
  };
}

export interface PasswordResetInput {
  name: string;
  resetUrl: string;
  expiresInMinutes: number;
}

export function passwordResetMail(input: PasswordResetInput): MailText {
  const lifetime = input.expiresInMinutes % 60 === 0 ? `${input.expiresInMinutes / 60} hour${input.expiresInMinutes === 60 ? '' : 's'}` : `${input.expiresInMinutes} minutes`;
  return {
    subject: 'Set a new Benchwright password',
    text: [
      greeting(input.name),
      '',
      'Someone (we hope you) asked to set a new password for your Benchwright account. Choose a new one with this link:',
      input.resetUrl,
      '',
      `The link works once, for ${lifetime}. Setting a new password signs you out everywhere.`,
      '',
      'If you did not ask for this, ignore this e-mail: your password stays as it is.',
      '',
      SIGN_OFF,
    ].join('\n'),
  };
}
