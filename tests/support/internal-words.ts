// What a person must never read: code names (camelCase keys such as overOperatingPlant or
// criticalThresholdPct, snake_case ids such as with_engineer), prefixed ids (stated:chartCapacity)
// and zod's own wording ("Invalid input: expected object, received undefined"). Used on the text
// of the main screens, the stamped return (pdftotext) and the e-mails.
const ADDRESSES = /\bhttps?:\/\/\S+|[\w.+-]+@[\w-]+(?:\.[\w-]+)+|\/api\/\S+/g;
const FILE_NAMES = /\b[\w.-]+\.(?:pdf|csv|xlsx|png|jpe?g|txt)\b/gi;

const RULES: [string, RegExp][] = [
  ['camelCase name', /\b[a-z]{2,}(?:[A-Z][a-z0-9]+)+\b/g],
  ['snake_case name', /\b[a-z][a-z0-9]*(?:_[a-z0-9]+)+\b/g],
  ['prefixed id', /\b[a-z]+:[a-z]+[A-Z]\w*\b/g],
  [
    'zod wording',
    /Invalid input|Invalid option|expected (?:string|number|object|array|boolean)|received (?:undefined|null)|Too (?:big|small): expected/g,
  ],
];

/** Each leak found in `text`, as "<rule>: <token>", once per token. */
export function internalWords(text: string, allow: readonly string[] = []): string[] {
  const readable = text.replace(ADDRESSES, ' ').replace(FILE_NAMES, ' ');
  const found = new Set<string>();
  for (const [rule, pattern] of RULES)
    for (const m of readable.matchAll(pattern)) if (!allow.includes(m[0])) found.add(`${rule}: ${m[0]}`);
  return [...found];
}
