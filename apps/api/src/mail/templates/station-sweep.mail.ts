import type { MailMessage } from '../mailer.service';
import { escapeHtml, htmlFrame } from './escape-html';

export interface StationSweepMailInput {
  to: string;
  managerName: string;
  stationName: string;
  tokenLabel: string;
  assignmentId: number;
  task: string;
  waferNumber: string;
  lotCode: string;
  link: string;
}

/** The e-mail the assigning manager gets when a station posted the sweep of an assignment. */
export function stationSweepMail(input: StationSweepMailInput): MailMessage {
  const subject = `Rhotrace: station ${input.stationName} sent the sweep of wafer ${input.waferNumber} (lot ${input.lotCode})`;
  const text = [
    `Hello ${input.managerName},`,
    '',
    `Probe station ${input.stationName} (token "${input.tokenLabel}") sent its sweep for the`,
    `task you assigned. The assignment is now done and the wafer marked measured.`,
    '',
    `Task:     ${input.task}`,
    `Wafer:    ${input.waferNumber} of lot ${input.lotCode}`,
    '',
    `Open the wafer: ${input.link}`,
  ].join('\n');
  const html = htmlFrame(
    subject,
    [
      `<p>Hello ${escapeHtml(input.managerName)},</p>`,
      `<p>Probe station ${escapeHtml(input.stationName)} (token “${escapeHtml(input.tokenLabel)}”) ` +
        'sent its sweep for the task you assigned. The assignment is now done and the wafer ' +
        'marked measured.</p>',
      '<table style="border-collapse: collapse">',
      `<tr><th align="left">Task</th><td>${escapeHtml(input.task)}</td></tr>`,
      `<tr><th align="left">Wafer</th><td>${escapeHtml(input.waferNumber)} of lot ${escapeHtml(input.lotCode)}</td></tr>`,
      '</table>',
      `<p><a href="${escapeHtml(input.link)}">Open the wafer in Rhotrace</a></p>`,
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
