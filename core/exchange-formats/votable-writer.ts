import { textRows, type ExportColumn } from './export-columns.ts';

/** What a VOTable document says about its one table besides the columns and rows. */
export interface VoTableDescription {
  /** RESOURCE name, e.g. "meridian-ledger-solve". */
  readonly resourceName: string;
  /** TABLE name, e.g. "stars". */
  readonly tableName: string;
  /** Free text for the table's DESCRIPTION element. */
  readonly description: string;
}

/**
 * XML text escaping for element content and double-quoted attributes (XML 1.0 §2.4 and §3.3.3):
 * &, <, >, " and ' as entity references. Characters XML 1.0 forbids (controls other than tab,
 * line feed and carriage return; lone surrogates; U+FFFE/U+FFFF) cannot be written at all and are
 * refused with their position, never dropped.
 */
export function escapeXml(text: string, where: string): string {
  // eslint-disable-next-line no-control-regex -- the XML 1.0 §2.2 Char production, written out
  const forbidden = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\ufffe\uffff]|[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/u;
  const bad = forbidden.exec(text);
  if (bad !== null) throw new RangeError(`${where}: character U+${bad[0].charCodeAt(0).toString(16).padStart(4, '0')} at position ${bad.index} is not allowed in XML 1.0; remove it`);
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c] ?? c);
}

function fieldElement<Row>(column: ExportColumn<Row>, where: string): string {
  const attribute = (name: string, value: string | undefined): string => (value === undefined ? '' : ` ${name}="${escapeXml(value, where)}"`);
  const arraysize = column.datatype === 'char' ? ' arraysize="*"' : '';
  const datatype = column.datatype === 'char' ? 'char' : column.datatype;
  return `      <FIELD${attribute('name', column.name)} datatype="${datatype}"${arraysize}${attribute('unit', column.unit)}${attribute('ucd', column.ucd)}>\n` +
    `        <DESCRIPTION>${escapeXml(column.description, where)}</DESCRIPTION>\n      </FIELD>\n`;
}

/**
 * A VOTable 1.4 document (IVOA Recommendation 2019-10-21) holding one RESOURCE with one TABLE: a
 * FIELD per column (name, datatype, unit, ucd) and the rows as DATA/TABLEDATA, one TR of TDs each.
 * Numbers are the shortest decimals that read back to the same double; an unknown value is an
 * empty TD, which VOTable 1.4 §6 reads as null for every datatype. Text is XML-escaped and the
 * document is meant to be stored as UTF-8 (its declaration says so). `char` columns are written
 * as datatype="char" arraysize="*"; their content is UTF-8 text, which readers that keep to ASCII
 * for `char` may garble (unicodeChar would be the strict type).
 */
export function writeVoTable<Row>(table: VoTableDescription, columns: readonly ExportColumn<Row>[], rows: readonly Row[]): string {
  const where = `VOTable ${table.tableName}`;
  const cells = textRows(table.tableName, columns, rows);
  const parts: string[] = [
    '<?xml version="1.0" encoding="UTF-8"?>\n',
    // VOTable 1.4 keeps the 1.3 namespace (from memory).
    '<VOTABLE version="1.4" xmlns="http://www.ivoa.net/xml/VOTable/v1.3">\n',
    `  <RESOURCE name="${escapeXml(table.resourceName, where)}">\n`,
    `    <TABLE name="${escapeXml(table.tableName, where)}" nrows="${rows.length}">\n`,
    `      <DESCRIPTION>${escapeXml(table.description, where)}</DESCRIPTION>\n`,
    ...columns.map((c) => fieldElement(c, `${where}, FIELD ${c.name}`)),
    '      <DATA>\n        <TABLEDATA>\n',
  ];
  for (const [k, row] of cells.entries()) {
    parts.push(`          <TR>${row.map((cell, c) => `<TD>${escapeXml(cell, `${where} row ${k + 1}, column ${columns[c].name}`)}</TD>`).join('')}</TR>\n`);
  }
  parts.push('        </TABLEDATA>\n      </DATA>\n    </TABLE>\n  </RESOURCE>\n</VOTABLE>\n');
  return parts.join('');
}
