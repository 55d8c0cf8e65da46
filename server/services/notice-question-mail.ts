// The e-mails of a notice's questions: the grower's question to the adviser (Reply-To the grower), and the
// adviser's answer to the grower (Reply-To the adviser), both through the one mail transport.
import { config } from '../config.ts';
import { mailTransport } from '../mail/transport.ts';
import { organisationHeader } from '../mail/organisation-header.ts';
import { escapeHtml } from './escape-html.ts';

export interface QuestionMailFacts {
  organisationId: string;
  noticeId: string;
  fieldName: string;
  farmName: string;
  pestName: string;
  askerName: string;
  askerEmail: string;
  question: string;
}

const paragraphs = (text: string) =>
  text
    .split(/\n{2,}/)
    .map((p) => `<p>${escapeHtml(p).replace(/\n/g, '<br>')}</p>`)
    .join('');
const quoted = (text: string) =>
  text
    .split('\n')
    .map((line) => `> ${line}`)
    .join('\n');

/** Tells the adviser who wrote the notice; a reply goes straight to the grower. */
export async function mailQuestionToAdviser(facts: QuestionMailFacts, adviser: { name: string; email: string }) {
  const page = `${config.publicUrl}/notices/${facts.noticeId}`;
  const subject = `Question from ${facts.askerName} on the ${facts.pestName} notice for ${facts.fieldName}, ${facts.farmName}`;
  await mailTransport().sendMail({
    from: config.mailFrom,
    to: { name: adviser.name, address: adviser.email },
    replyTo: { name: facts.askerName, address: facts.askerEmail },
    subject,
    text: [
      `${facts.askerName} <${facts.askerEmail}> wrote about the ${facts.pestName} notice for ${facts.fieldName} (${facts.farmName}):`,
      '',
      quoted(facts.question),
      '',
      `Answer in Patchwise: ${page}`,
      'Or reply to this e-mail to write to the grower directly.',
    ].join('\n'),
    html: `<p>${escapeHtml(facts.askerName)} &lt;${escapeHtml(facts.askerEmail)}&gt; wrote about the ${escapeHtml(facts.pestName)} notice for ${escapeHtml(facts.fieldName)} (${escapeHtml(facts.farmName)}):</p><blockquote>${paragraphs(facts.question)}</blockquote><p><a href="${escapeHtml(page)}">Answer in Patchwise</a>, or reply to this e-mail to write to the grower directly.</p>`,
    headers: organisationHeader(facts.organisationId),
  });
}

/** Sends the adviser's answer to the grower who asked; a reply goes to the adviser. */
export async function mailAnswerToGrower(
  facts: QuestionMailFacts,
  answer: { text: string; adviserName: string; adviserEmail: string; organisationName: string },
) {
  const subject = `Answer from ${answer.adviserName}: ${facts.pestName} notice for ${facts.fieldName}, ${facts.farmName}`;
  await mailTransport().sendMail({
    from: config.mailFrom,
    to: { name: facts.askerName, address: facts.askerEmail },
    replyTo: { name: answer.adviserName, address: answer.adviserEmail },
    subject,
    text: [
      `${answer.adviserName} (${answer.organisationName}) answered your question on the ${facts.pestName} notice for ${facts.fieldName}:`,
      '',
      answer.text,
      '',
      'You asked:',
      quoted(facts.question),
      '',
      'The answer is also shown on the notice page.',
    ].join('\n'),
    html: `<p>${escapeHtml(answer.adviserName)} (${escapeHtml(answer.organisationName)}) answered your question on the ${escapeHtml(facts.pestName)} notice for ${escapeHtml(facts.fieldName)}:</p>${paragraphs(answer.text)}<p>You asked:</p><blockquote>${paragraphs(facts.question)}</blockquote><p>The answer is also shown on the notice page.</p>`,
    headers: organisationHeader(facts.organisationId),
  });
}
