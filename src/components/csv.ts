/** CSV text written by papaparse, and a browser download of it. */
import Papa from 'papaparse';

/**
 * A header and rows as CSV, quoted where needed. A text cell that a spreadsheet would run as a
 * formula (starting with =, +, -, @, tab or carriage return) is escaped by papaparse; numbers
 * stay numbers.
 */
export function toCsv(header: string[], rows: (string | number | null)[][]): string {
  return (
    Papa.unparse({ fields: header, data: rows }, { newline: '\n', escapeFormulae: true }) + '\n'
  );
}

export function downloadText(filename: string, text: string, type = 'text/csv'): void {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const a = document.createElement('a');
  a.href = url;
  a.download = filename;
  a.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
