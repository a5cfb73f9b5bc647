// IMO ship identification number: seven digits, the last a check digit.
// Scheme of IMO Resolution A.1117(30), mandatory under SOLAS XI-1/3: multiply the first six digits
// by 7, 6, 5, 4, 3, 2; the last digit of the sum is the seventh digit.

const WEIGHTS = [7, 6, 5, 4, 3, 2] as const;

/** Strips an optional "IMO" prefix and spaces: "IMO 9074729" → "9074729". */
export function normaliseImo(input: string): string {
  return input.trim().replace(/^imo\s*/i, "").replace(/\s+/g, "");
}

export function imoCheckDigit(firstSix: string): number {
  if (!/^[0-9]{6}$/.test(firstSix)) throw new Error(`expected six digits, got "${firstSix}"`);
  const sum = WEIGHTS.reduce((acc, weight, i) => acc + weight * Number(firstSix[i]), 0);
  return sum % 10;
}

/** Why an IMO number is not valid, or null when it is. */
export function imoProblem(input: string): string | null {
  const digits = normaliseImo(input);
  if (!/^[0-9]{7}$/.test(digits)) return "An IMO number has exactly seven digits, e.g. IMO 9074729.";
  const expected = imoCheckDigit(digits.slice(0, 6));
  if (Number(digits[6]) !== expected) {
    return `The check digit does not match: with ${digits.slice(0, 6)} the last digit must be ${expected}.`;
  }
  return null;
}

export function isValidImo(input: string): boolean {
  return imoProblem(input) === null;
}
