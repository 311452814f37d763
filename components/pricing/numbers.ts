/** A number typed in a form field ("2,5" allowed); NaN for blank or junk, which the server's schema answers with a message. */
export function typedNumber(text: string): number {
  const s = text.trim().replace(',', '.');
  return s === '' || !/^[+-]?(\d+\.?\d*|\.\d+)$/.test(s) ? Number.NaN : Number(s);
}
