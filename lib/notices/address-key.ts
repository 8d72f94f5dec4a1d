/**
 * One household, one key: letters and digits of the postal address, lower-case, accents
 * dropped, everything else a single space. "12 Mill Lane,  Quillon" and "12 mill lane quillon"
 * give the same key.
 */
export function addressKey(postalAddress: string): string {
  return postalAddress
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, ' ')
    .trim();
}
