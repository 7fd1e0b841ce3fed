import type { MailMessage } from '../mailer.service';
import type { PlannerResponse } from '@rhotrace/api-types';
import { escapeHtml, htmlFrame } from './escape-html';
import { planHtml, planText } from './plan-summary';

export interface AssignmentMailInput {
  to: string;
  assigneeName: string;
  assignedByName: string;
  assignmentId: number;
  task: string;
  dueDate: string;
  notes: string | null;
  waferNumber: string;
  lotCode: string;
  material: string;
  link: string;
  cautions: string[];
  /** The attached measurement plan, if any: summarised, with its cautions added to the list. */
  plan?: PlannerResponse | null;
}

/** The e-mail an assignee gets: what, which wafer and lot, due when, a link, safety notes. */
export function assignmentMail(input: AssignmentMailInput): MailMessage {
  const plan = input.plan ?? null;
  // The plan's cautions (cryogen, hot chuck) join the task's, each once; both lists end with the
  // reminder that the lab's rules come first, which stays last.
  const last = input.cautions.at(-1);
  const cautions = [
    ...new Set([...input.cautions.slice(0, -1), ...(plan?.cautions ?? []), ...input.cautions]),
  ].filter((c) => c !== last);
  if (last !== undefined) cautions.push(last);

  const subject = `Rhotrace: ${input.task} on wafer ${input.waferNumber} of lot ${input.lotCode} (due ${input.dueDate})`;
  const text = [
    `Hello ${input.assigneeName},`,
    '',
    `${input.assignedByName} has assigned you a task in Rhotrace.`,
    '',
    `Task:     ${input.task}`,
    `Wafer:    ${input.waferNumber} of lot ${input.lotCode} (${input.material})`,
    `Due:      ${input.dueDate}`,
    ...(input.notes ? [`Notes:    ${input.notes}`] : []),
    '',
    `Open the wafer: ${input.link}`,
    '',
    ...(plan ? [...planText(plan), ''] : []),
    'Safety before you start:',
    ...cautions.map((c) => `- ${c}`),
  ].join('\n');
  const html = htmlFrame(
    subject,
    [
      `<p>Hello ${escapeHtml(input.assigneeName)},</p>`,
      `<p>${escapeHtml(input.assignedByName)} has assigned you a task in Rhotrace.</p>`,
      '<table style="border-collapse: collapse">',
      `<tr><th align="left">Task</th><td>${escapeHtml(input.task)}</td></tr>`,
      `<tr><th align="left">Wafer</th><td>${escapeHtml(input.waferNumber)} of lot ${escapeHtml(input.lotCode)} (${escapeHtml(input.material)})</td></tr>`,
      `<tr><th align="left">Due</th><td>${escapeHtml(input.dueDate)}</td></tr>`,
      ...(input.notes
        ? [`<tr><th align="left">Notes</th><td>${escapeHtml(input.notes)}</td></tr>`]
        : []),
      '</table>',
      `<p><a href="${escapeHtml(input.link)}">Open the wafer in Rhotrace</a></p>`,
      ...(plan ? planHtml(plan) : []),
      '<h2 style="font-size: 1.1em">Safety before you start</h2>',
      '<ul>',
      ...cautions.map((c) => `<li>${escapeHtml(c)}</li>`),
      '</ul>',
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
