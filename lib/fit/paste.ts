/**
 * Cells copied from a spreadsheet arrive as tab-separated text: rows end with a line break, cells
 * are separated by tabs, and a cell holding a tab, a line break or a quote is wrapped in double
 * quotes with inner quotes doubled (the text/tab-separated-values convention, IANA media type
 * registration; spreadsheets follow the CSV quoting rules of RFC 4180 for it).
 */

/** Splits clipboard text into rows of cells. A trailing line break does not make an empty row. */
export function splitClipboardGrid(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let quoted = false;
  let i = 0;
  const src = text.replace(/\r\n?/g, '\n');
  // A lone cell without tabs or line breaks is taken literally, quotes and all.
  if (!/[\t\n]/.test(src)) return src === '' ? [] : [[src]];
  while (i < src.length) {
    const ch = src[i]!;
    if (quoted) {
      if (ch === '"' && src[i + 1] === '"') { cell += '"'; i += 2; continue; }
      if (ch === '"') { quoted = false; i += 1; continue; }
      cell += ch;
      i += 1;
      continue;
    }
    if (ch === '"' && cell === '') { quoted = true; i += 1; continue; }
    if (ch === '\t') { row.push(cell); cell = ''; i += 1; continue; }
    if (ch === '\n') { row.push(cell); rows.push(row); row = []; cell = ''; i += 1; continue; }
    cell += ch;
    i += 1;
  }
  if (cell !== '' || row.length > 0) { row.push(cell); rows.push(row); }
  return rows;
}
