import type { MailMessage } from '../mailer.service';
import { escapeHtml, htmlFrame } from './escape-html';

export interface OverdueMailInput {
  to: string;
  assigneeName: string;
  assignmentId: number;
  task: string;
  dueDate: string;
  daysLate: number;
  waferNumber: string;
  lotCode: string;
  link: string;
}

/** The daily reminder an assignee gets while a task of theirs is past its due date. */
export function overdueMail(input: OverdueMailInput): MailMessage {
  const late = input.daysLate === 1 ? '1 day' : `${input.daysLate} days`;
  const subject = `Rhotrace: overdue by ${late}: wafer ${input.waferNumber} (lot ${input.lotCode})`;
  const text = [
    `Hello ${input.assigneeName},`,
    '',
    `This task was due on ${input.dueDate} and is still open (${late} late).`,
    'If it is done, mark it so in your queue; if it cannot be done, tell the person who assigned it.',
    '',
    `Task:     ${input.task}`,
    `Wafer:    ${input.waferNumber} of lot ${input.lotCode}`,
    `Due:      ${input.dueDate}`,
    '',
    `Open the wafer: ${input.link}`,
    '',
    'You get one reminder a day while the task stays overdue.',
  ].join('\n');
  const html = htmlFrame(
    subject,
    [
      `<p>Hello ${escapeHtml(input.assigneeName)},</p>`,
      `<p>This task was due on ${escapeHtml(input.dueDate)} and is still open (${late} late). ` +
        'If it is done, mark it so in your queue; if it cannot be done, tell the person who ' +
        'assigned it.</p>',
      '<table style="border-collapse: collapse">',
      `<tr><th align="left">Task</th><td>${escapeHtml(input.task)}</td></tr>`,
      `<tr><th align="left">Wafer</th><td>${escapeHtml(input.waferNumber)} of lot ${escapeHtml(input.lotCode)}</td></tr>`,
      `<tr><th align="left">Due</th><td>${escapeHtml(input.dueDate)}</td></tr>`,
      '</table>',
      `<p><a href="${escapeHtml(input.link)}">Open the wafer in Rhotrace</a></p>`,
      '<p>You get one reminder a day while the task stays overdue.</p>',
    ].join('\n'),
  );
  return {
    to: input.to,
    subject: subject.replace(/[\r\n\t]+/g, ' ').slice(0, 300),
    text,
    html,
    relatedEntity: 'assignment',
    relatedId: input.assignmentId,
  };
}
