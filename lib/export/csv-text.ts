/**
 * Free text for a CSV cell, safe to open in a spreadsheet: a cell that begins with = + - @, a tab
 * or a carriage return would be read as a formula, so it gets a leading apostrophe (OWASP, "CSV
 * Injection"). The one guard for every CSV we write; `unguardCsvText` undoes it on import.
 */
export const guardCsvText = (s: string | null | undefined): string => (s ? (/^[=+\-@\t\r]/.test(s) ? `'${s}` : s) : '');
/** The inverse of guardCsvText, for a CSV we read back (the bearings import). */
export const unguardCsvText = (s: string): string => (/^'[=+\-@\t\r]/.test(s) ? s.slice(1) : s);
