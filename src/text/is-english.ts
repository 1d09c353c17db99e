/** Whether a BCP 47 language tag is English (`en`, `en-GB`, …): the languages wink-nlp tokenizes. */
export function isEnglish(language: string): boolean {
  return language === 'en' || language.startsWith('en-');
}
