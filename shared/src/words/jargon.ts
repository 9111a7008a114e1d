/**
 * Developer words that must never reach a person in a message: what the wording tests look for.
 * The rule behind it is WCAG 2.2 Success Criteria 3.3.1 (Error Identification: the error is
 * described to the user in text) and 3.3.3 (Error Suggestion), read together with plain-language
 * practice: a person is told what is wrong and what to do in their words, not the program's.
 * The patterns themselves are common practice, no published source.
 */
export const jargonPatterns: ReadonlyArray<{ name: string; pattern: RegExp }> = [
  { name: 'a camelCase field name', pattern: /\b[a-z]{2,}(?:[A-Z][a-z0-9]+)+\b/ },
  { name: 'a snake_case code', pattern: /\b[a-z0-9]+_[a-z0-9_]+\b/ },
  { name: 'a path into the request', pattern: /\w\[\d+\]|\b[A-Za-z]+\.\d+\b/ },
  { name: 'a message that opens with a field name', pattern: /^[a-z][A-Za-z]*(?::| must\b| is\b| takes\b| can\b| has\b)/ },
  { name: '"must not be empty"', pattern: /must not be empty/i },
  { name: '"must be an e-mail address"', pattern: /must be an e-mail address/i },
  { name: '"(from memory)"', pattern: /from memory/i },
  { name: 'a developer term', pattern: /\b(?:UUID|GUID|IANA|ISO \d{4}|YYYY-MM-DD|NaN|undefined|null|boolean|regex|enum)\b/ },
  {
    name: 'zod’s own wording',
    pattern: /Invalid input|expected (?:string|number|object|array|boolean)|received (?:undefined|null|string|number)/i,
  },
];

/** Text a person typed or a value echoed back in quotes is theirs, not our jargon. */
const quoted = /"[^"]*"|“[^”]*”|'[^' ]*'/g;

/** The jargon found in one message, by name (empty when the message is plain). */
export function jargonIn(message: string): string[] {
  const own = message.replace(quoted, '""');
  return jargonPatterns.filter(({ pattern }) => pattern.test(own)).map(({ name }) => name);
}
