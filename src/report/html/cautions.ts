/**
 * The cautions printed in every report (our own wording; the README carries the same points).
 * Each is one sentence a reader can act on.
 */
export const REPORT_CAUTIONS: readonly string[] = [
  'The scores in this report are research measures computed from word lists. They are not clinical assessments and were never validated as such.',
  'Do not use them to judge any individual\'s mental health, wellbeing or risk, or to make decisions about a person.',
  'Dictionary methods count words: they miss sarcasm, irony, context, quotation, dialect and slang, and they can misread people who write differently from the texts their word lists were built on.',
  'Message archives hold other people\'s words as well as the participant\'s. Collecting and analysing them needs ethics approval and the informed consent your protocol requires.',
  'Keep to the data-protection law that applies where the data were collected and are processed, and to the conditions set by your ethics committee; share outputs only as they allow.',
];

/** The cautions as an HTML list. */
export function cautions(): string {
  return `<ul class="cautions">${REPORT_CAUTIONS.map((c) => `<li>${c.replace(/&/g, '&amp;').replace(/</g, '&lt;')}</li>`).join('')}</ul>`;
}
