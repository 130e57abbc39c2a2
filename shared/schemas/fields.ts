/**
 * Field builders every schema uses, so one rule holds for each kind of text: trimmed, bounded,
 * well-formed Unicode (a lone UTF-16 surrogate cannot be stored or printed), and for single-line
 * fields no control characters, so a name can never add a line to an e-mail or a label.
 */
import { z } from 'zod';

/** A UTF-16 high surrogate not followed by a low one, or a low one not preceded by a high one. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
/** C0 and C1 controls, DEL, and the Unicode line and paragraph separators. */
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const CONTROL = /[\u0000-\u001F\u007F-\u009F\u2028\u2029]/;

export const WELL_FORMED_MESSAGE = 'Contains a broken character (a lone UTF-16 surrogate)';
export const SINGLE_LINE_MESSAGE = 'Must be one line without control characters';

/** Free text (line breaks allowed), trimmed, at most `max` characters. */
export const text = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `At most ${max} characters`)
    .refine((s) => !LONE_SURROGATE.test(s), WELL_FORMED_MESSAGE);

/** One line of text: a name, a label, a contact. Refuses line breaks, tabs and other control characters. */
export const singleLine = (max: number) => text(max).refine((s) => !CONTROL.test(s), SINGLE_LINE_MESSAGE);

/** A calendar date written YYYY-MM-DD that exists. */
export const isoDate = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use the form YYYY-MM-DD')
  .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), 'Not a real date');

/** An id inside a document (device, circuit, survey way): letters, digits, - and _. */
export const key = z
  .string()
  .min(1, 'Required')
  .max(40, 'At most 40 characters')
  .regex(/^[A-Za-z0-9_-]+$/, 'Letters, digits, - and _ only');

/** A positive number with a label in its messages. */
export const positive = (label: string, max: number) =>
  z
    .number({ error: `${label} must be a number` })
    .positive(`${label} must be above zero`)
    .max(max, `${label} is at most ${max}`);

/** An e-mail address as typed: trimmed, lower-cased, of the length mail allows. */
export const emailAddress = z.string().trim().toLowerCase().max(254, 'At most 254 characters').email('Not a valid e-mail address');

/** A person's name: one line. */
export const personName = singleLine(120).min(1, 'Required');

/**
 * The revision a save was made from (sites, organisation settings, sheet layouts): the server writes only
 * while the row is still at it, else 409 `stale` with the current revision, so nobody's save is overwritten unseen.
 */
export const baseRevision = z.number({ error: 'baseRevision is required' }).int('baseRevision is required').min(1, 'baseRevision is required');
