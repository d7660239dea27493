// Validation messages in a person's words. The schemas name fields by their path
// ("crane.boomLength must be greater than 0") and zod's own messages are written for developers
// ("Invalid input: expected object, received undefined"); a person reads neither. Every message
// that leaves the API or shows under a field goes through readableIssue(): paths become the field
// labels of the catalogue, zod's wordings become sentences.
import { labelOfAnyPath } from './multi-crane-steps';

/** A field path or a code-style name inside a sentence: crane.boomLength, multiCrane.others[], siteId. */
const PATH_TOKEN =
  /(?<![-/@\w.])\b[a-z][a-zA-Z0-9]+(?:\[\])?(?:\.(?:\d+|[a-zA-Z][a-zA-Z0-9]+)(?:\[\])?)+|\b[a-z]{2,}[A-Z][a-zA-Z0-9]*\b/g;
const looksLikePath = (s: string) => new RegExp(PATH_TOKEN.source).test(s);

const TYPE_WORDS: Record<string, string> = {
  number: 'a number',
  string: 'text',
  boolean: 'yes or no',
  object: 'filled in',
  array: 'a list',
  date: 'a date',
  int: 'a whole number',
};

/** 'plannedLiftDate' → 'Planned lift date', 'organisationId' → 'Organisation'. */
function humanise(name: string): string {
  const last =
    name
      .replace(/\[\]/g, '')
      .split('.')
      .filter((part) => part && !/^\d+$/.test(part))
      .at(-1) ?? name;
  const words = last
    .replace(/Id$/, '')
    .replace(/^min(?=[A-Z])/, 'minimum')
    .replace(/^max(?=[A-Z])/, 'maximum')
    .replace(/Pct$/, ' (%)')
    .replace(/Mps$/, ' (m/s)')
    .replace(/Deg$/, ' (°)')
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replace(/_/g, ' ')
    .toLowerCase()
    .trim();
  return words ? words[0].toUpperCase() + words.slice(1) : 'This field';
}

/** The label a person reads for a field path ('inputs.crane.boomLength' → 'Boom length'). */
export function readableField(path: string): string {
  if (!path || path === '(root)') return 'The request';
  if (/^params\.\w*id$/i.test(path)) return 'The id in the address';
  const label = labelOfAnyPath(path);
  const clean = path.replace(/^inputs\./, '').replace(/\.value$|\.unit$/, '');
  // The catalogue answers with the path itself when it does not know the field.
  return label === clean || label === path || looksLikePath(label) ? humanise(label) : label;
}

function reword(message: string, label: string): string | null {
  let m = /^Invalid input: expected (\w+), received (\w+)$/.exec(message);
  if (m) {
    if (m[2] === 'undefined' || m[2] === 'null') return `${label} is required`;
    return `${label} must be ${TYPE_WORDS[m[1]] ?? 'filled in'}`;
  }
  if (/^Invalid (option|input): expected one of/.test(message) || /^Invalid enum value/.test(message))
    return `${label} must be one of the choices offered`;
  m = /^Too (big|small): expected (string|array|number) to (?:have|be) ([<>]=?)\s?([\d.,]+)(?: (\w+))?/.exec(
    message,
  );
  if (m) {
    const most = m[1] === 'big';
    const unit = m[2] === 'string' ? ' characters' : m[2] === 'array' ? ' items' : '';
    const strict = m[3].length === 1;
    const n = m[4];
    if (most) return `${label} must be ${strict ? 'under' : 'at most'} ${n}${unit}`;
    if (m[2] === 'string' && n === '1' && !strict) return `${label} is required`;
    return `${label} must be ${strict ? 'more than' : 'at least'} ${n}${unit}`;
  }
  if (/^Unrecognized keys?/.test(message)) return `${label} has entries the desk does not take`;
  if (/^Invalid (UUID|uuid|string|format|email|url|ISO date|date|datetime)/i.test(message))
    return `${label} is not in the expected form`;
  if (/^Invalid input$/.test(message)) return `${label} is not valid`;
  return null;
}

/**
 * The message for one validation issue, in words: names the field by its label, keeps the limit
 * the schema states. `path` is the dotted path of the issue ('crane.boomLength.value').
 */
export function readableIssue(path: string, message: string): string {
  const label = readableField(path);
  const lower = message.toLowerCase();
  if (lower.startsWith(`the ${label.toLowerCase()}`)) return message;
  if (lower.startsWith(label.toLowerCase())) return `${label}${message.slice(label.length)}`;
  const reworded = reword(message, label);
  if (reworded) return reworded;
  const clean = path.replace(/^inputs\./, '').replace(/\.value$|\.unit$/, '');
  const own = [clean, clean.split('.').at(-1)].find((name) => name && message.startsWith(`${name} `));
  if (own) {
    const rest = message.slice(own.length);
    const note = /^ \(([^)]*)\)/.exec(rest);
    const keep =
      note && label.toLowerCase().includes(note[1].toLowerCase()) ? rest.slice(note[0].length) : rest;
    message = `${label}${keep}`;
  }
  let named = Boolean(own);
  // A path followed by a note the label already says ("crane.boomAngle (from horizontal)") loses the note.
  const withNote = new RegExp(`(${PATH_TOKEN.source})( \\(([^)]*)\\))?`, 'g');
  const text = message.replace(withNote, (_all, token: string, note?: string, inside?: string) => {
    named = true;
    const field = readableField(token);
    return note && !field.toLowerCase().includes(inside!.toLowerCase()) ? `${field}${note}` : field;
  });
  return named ? text : `${label}: ${text}`;
}

/** "crane.boomLength: the chart has no such boom" → "Boom length: the chart has no such boom". */
function readableHead(message: string): string {
  const m = /^([a-z][\w.[\]]*): ([\s\S]+)$/.exec(message);
  return m ? readableIssue(m[1], m[2]) : message;
}

/** An API error's message and fields, in words (the paths themselves stay, for the client). */
export function readableError<F extends { path: string; message: string }>(
  message: string,
  fields?: F[],
): { message: string; fields?: F[] } {
  return {
    message: readableHead(message),
    ...(fields ? { fields: fields.map((f) => ({ ...f, message: readableIssue(f.path, f.message) })) } : {}),
  };
}
