import type { MailMessage } from '../mailer.service';
import { escapeHtml, htmlFrame } from './escape-html';

/** The password reset e-mail: a single-use link valid for `validMinutes`. */
export function passwordResetMail(input: {
  to: string;
  name: string;
  link: string;
  validMinutes: number;
}): MailMessage {
  const subject = 'Rhotrace: reset your password';
  const text = [
    `Hello ${input.name},`,
    '',
    'Someone (hopefully you) asked to reset the password of your Rhotrace account.',
    `Open this link within ${input.validMinutes} minutes to choose a new password:`,
    '',
    input.link,
    '',
    'The link works once. If you did not ask for this, ignore this message; your password stays',
    'as it is.',
  ].join('\n');
  const html = htmlFrame(
    subject,
    [
      `<p>Hello ${escapeHtml(input.name)},</p>`,
      '<p>Someone (hopefully you) asked to reset the password of your Rhotrace account.',
      `Open this link within ${input.validMinutes} minutes to choose a new password:</p>`,
      `<p><a href="${escapeHtml(input.link)}">Choose a new password</a></p>`,
      '<p>The link works once. If you did not ask for this, ignore this message; your password',
      'stays as it is.</p>',
    ].join('\n'),
  );
  return { to: input.to, subject, text, html, relatedEntity: 'user' };
}
