import type { Rejection } from '../../core/formats/parse-result.ts';

function field(value: string | number): string {
  const text = String(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/**
 * The rejections of one file as RFC 4180 CSV (CRLF line ends, header `row,line,column,reason`),
 * for the user to fix the file with; row 0 is the header or the whole file.
 */
export function rejectsCsv(rejected: readonly Rejection[]): string {
  const lines = ['row,line,column,reason', ...rejected.map((r) => [r.row, r.line, r.column, r.reason].map(field).join(','))];
  return `${lines.join('\r\n')}\r\n`;
}
