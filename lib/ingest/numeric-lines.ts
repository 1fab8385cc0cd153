/**
 * The fast lane of the CSV reader: lines of plain numbers read straight from the bytes, with
 * no string made per line or per cell. A logger's file is almost all such lines, and reading
 * them through a general CSV parser (a string per cell, a regular expression per number) was
 * most of the time an upload spent before it was fitted.
 *
 * Only what is certain is taken here: a line whose cell count matches the header and whose
 * wanted cells are numbers — decimals of at most 15 significant digits read digit by digit,
 * longer ones and exponents by Number() on the number's text.
 * Anything else — quotes, stray text, a short row — goes back to the general reader, which
 * says what is wrong with the row and column, so both lanes give the same table and the same
 * messages.
 *
 * Exactness: a decimal with mantissa m < 2^53 (15 digits) and k ≤ 15 digits after the point
 * is m / 10^k with both operands exact doubles, so the one division rounds correctly and
 * gives the same double as Number(text) (Clinger, "How to read floating point numbers
 * accurately", PLDI 1990, the fast path).
 */

const SPACE = 0x20;
const TAB = 0x09;
const MINUS = 0x2d;
const PLUS = 0x2b;
const POINT = 0x2e;
const ZERO = 0x30;
const NINE = 0x39;

/** 10^k for k = 0…15, each exact. */
const POWERS_OF_TEN = Array.from({ length: 16 }, (_, k) => 10 ** k);

/** Most significant digits read in the fast lane: 15 keeps the mantissa below 2^53. */
export const FAST_DIGITS = 15;

/** Where the last parseDecimalAt stopped: after the number and any blanks behind it. Module scratch, allocation-free. */
let parsedEnd = 0;

const LOWER_E = 0x65;
const UPPER_E = 0x45;
/** Buffer's own Latin-1 decoder, which works on any Uint8Array: the one string made for a long number. */
const latin1 = Buffer.prototype.latin1Slice as (this: Uint8Array, start: number, end: number) => string;

/**
 * The decimal starting at bytes[i] (blanks before and after allowed; a tab counts as a blank
 * unless it is the delimiter), read up to `end` or the delimiter; NaN when there is none. The
 * syntax is the general reader's (sign, digits, point, digits, exponent). Up to FAST_DIGITS
 * digits without an exponent are converted digit by digit; longer ones (full-precision doubles)
 * and exponents by Number() on the token's text, so the value is always the one Number() gives.
 * Sets parsedEnd.
 */
function parseDecimalAt(bytes: Uint8Array, i: number, end: number, delimiter: number): number {
  const tabIsBlank = delimiter !== TAB;
  while (i < end && (bytes[i] === SPACE || (tabIsBlank && bytes[i] === TAB))) i++;
  const tokenStart = i;
  let negative = false;
  if (i < end && bytes[i] === MINUS) {
    negative = true;
    i++;
  } else if (i < end && bytes[i] === PLUS) i++;
  let mantissa = 0;
  let digits = 0;
  let decimals = 0;
  while (i < end) {
    const c = bytes[i];
    if (c < ZERO || c > NINE) break;
    mantissa = mantissa * 10 + (c - ZERO);
    digits++;
    i++;
  }
  if (i < end && bytes[i] === POINT) {
    i++;
    while (i < end) {
      const c = bytes[i];
      if (c < ZERO || c > NINE) break;
      mantissa = mantissa * 10 + (c - ZERO);
      digits++;
      decimals++;
      i++;
    }
  }
  let exponent = false;
  if (digits > 0 && i < end && (bytes[i] === LOWER_E || bytes[i] === UPPER_E)) {
    let j = i + 1;
    if (j < end && (bytes[j] === MINUS || bytes[j] === PLUS)) j++;
    const first = j;
    while (j < end && bytes[j] >= ZERO && bytes[j] <= NINE) j++;
    if (j > first) {
      exponent = true;
      i = j;
    }
  }
  const tokenEnd = i;
  while (i < end && (bytes[i] === SPACE || (tabIsBlank && bytes[i] === TAB))) i++;
  parsedEnd = i;
  if (digits === 0) return Number.NaN;
  if (exponent || digits > FAST_DIGITS) {
    const value = Number(latin1.call(bytes, tokenStart, tokenEnd));
    return Number.isFinite(value) ? value : Number.NaN;
  }
  const value = decimals === 0 ? mantissa : mantissa / POWERS_OF_TEN[decimals];
  return negative ? -value : value;
}

/**
 * The number written in bytes[start, end), spaces and tabs around it allowed, or NaN when the
 * text is not a plain decimal the fast lane takes (the general reader then decides).
 */
export function parseDecimalBytes(bytes: Uint8Array, start: number, end: number): number {
  const value = parseDecimalAt(bytes, start, end, -1);
  return parsedEnd === end ? value : Number.NaN;
}

const NUMBER_PATTERN = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * The number in a cell of text, or NaN. Unary plus accepts "", " " and "0x1f"; a calibration
 * file means none of those, so the cell must look like a decimal (an exponent allowed).
 */
export function parseNumber(cell: string | undefined): number {
  if (cell === undefined) return Number.NaN;
  const trimmed = cell.trim();
  if (trimmed === "" || !NUMBER_PATTERN.test(trimmed)) return Number.NaN;
  return Number(trimmed);
}

/**
 * Reads the cells at `wanted` (ascending column indices) of the line bytes[start, end) split
 * at `delimiter`, into `out` in the order of `wanted`. False when the line has other than
 * `width` cells or a wanted cell is not a plain decimal: the caller reads it the general way.
 * One pass over the bytes: wanted cells are read as they are scanned, others skipped.
 */
export function readNumericLine(
  bytes: Uint8Array,
  start: number,
  end: number,
  delimiter: number,
  width: number,
  wanted: Int32Array,
  out: Float64Array,
): boolean {
  let column = 0;
  let next = 0;
  let want = wanted.length > 0 ? wanted[0] : -1;
  let i = start;
  for (;;) {
    if (column === want) {
      const value = parseDecimalAt(bytes, i, end, delimiter);
      i = parsedEnd;
      if (value !== value || (i < end && bytes[i] !== delimiter)) return false;
      out[next++] = value;
      want = next < wanted.length ? wanted[next] : -1;
    } else {
      while (i < end && bytes[i] !== delimiter) i++;
    }
    column++;
    if (i >= end) break;
    i++; // past the delimiter
    if (column >= width) return false;
  }
  return column === width && next === wanted.length;
}

/** True when the text can go through the fast lane: no quotes, and no line ends with a lone carriage return. */
export function suitsFastLane(head: string): boolean {
  if (head.includes('"')) return false;
  for (let i = head.indexOf("\r"); i >= 0; i = head.indexOf("\r", i + 1)) {
    if (i + 1 < head.length && head.charCodeAt(i + 1) !== 0x0a) return false;
  }
  return true;
}
