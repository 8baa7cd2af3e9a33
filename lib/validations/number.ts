/**
 * Numbers as they arrive from forms and JSON: a number, or text in plain decimal notation (an
 * optional sign, digits with one decimal point, an optional exponent). Hex, binary and octal
 * literals, "Infinity" and "NaN" are not numbers a person types into a measurement field.
 */
export const decimalText = /^\s*[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?\s*$/;

/** Text in decimal notation as a number (NaN for any other text); other values as they are. */
export function readDecimal(v: unknown): unknown {
  if (typeof v !== 'string') return v;
  return decimalText.test(v) ? Number(v) : Number.NaN;
}
