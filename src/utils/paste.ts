/**
 * Clipboard text from a spreadsheet (tab-separated columns, one line per row) as a grid
 * of cells. A trailing line break (spreadsheets add one) makes no extra row.
 */
export function parseClipboard(text: string): string[][] {
  if (!text) return [];
  const lines = text.replace(/\r\n?/g, '\n').split('\n');
  if (lines.length > 1 && lines[lines.length - 1] === '') lines.pop();
  return lines.map((line) => line.split('\t').map(unquote));
}

/** Spreadsheets quote a cell holding a tab or a line break; plain cells pass unchanged. */
function unquote(cell: string): string {
  const t = cell.trim();
  if (t.length >= 2 && t.startsWith('"') && t.endsWith('"')) return t.slice(1, -1).replace(/""/g, '"');
  return t;
}

export interface PasteTarget {
  rowIndex: number;
  columnIndex: number;
}

/** Where each pasted cell lands: down from the focused cell and right across columns. */
export function pastePlacements(cells: string[][], start: PasteTarget, rowCount: number, columnCount: number) {
  const out: { rowIndex: number; columnIndex: number; text: string }[] = [];
  cells.forEach((row, r) => {
    const rowIndex = start.rowIndex + r;
    if (rowIndex >= rowCount) return;
    row.forEach((text, c) => {
      const columnIndex = start.columnIndex + c;
      if (columnIndex < columnCount) out.push({ rowIndex, columnIndex, text });
    });
  });
  return out;
}
