// Chart files in and out: a CSV or an .xlsx workbook becomes a table of cell values for the
// shared grid reader, and a grid becomes either file again. From a workbook only the stored
// values are read: a formula's cached result is taken (and said so), never calculated; a workbook
// with macros is refused; nothing in it is run. Limits name themselves in the messages.
import ExcelJS from 'exceljs';
import { cellRef, type RawCell } from '@shared/library/chart-cells';
import { gridToTable, type ChartGrid } from '@shared/library/chart-grid';
import {
  readChartGrid,
  type ChartPreview,
  MAX_GRID_COLUMNS,
  MAX_GRID_ROWS,
} from '@shared/library/chart-reader';
import { gridToCsv, previewText } from '@shared/library/chart-text';
import { AppError } from '../../lib/app-error';

const ZIP_MAGIC = Buffer.from([0x50, 0x4b, 0x03, 0x04]);

function kindOf(name: string, bytes: Buffer): 'csv' | 'xlsx' {
  if (bytes.subarray(0, 4).equals(ZIP_MAGIC)) return 'xlsx';
  if (/\.(xlsx|xlsm|xls)$/i.test(name))
    throw new AppError(
      415,
      'not_a_workbook',
      `${name} is not an .xlsx workbook (an older .xls cannot be read: save it as .xlsx or CSV).`,
      [{ path: 'file', message: 'file must be CSV or .xlsx' }],
    );
  return 'csv';
}

export async function previewChartFile(name: string, bytes: Buffer): Promise<ChartPreview> {
  if (kindOf(name, bytes) === 'csv') {
    const text = new TextDecoder('utf-8', { fatal: false }).decode(bytes);
    // eslint-disable-next-line no-control-regex -- a NUL means the file is not text
    if (/\u0000/.test(text.slice(0, 4096)))
      throw new AppError(415, 'not_text', `${name} is neither a CSV text file nor an .xlsx workbook.`, [
        { path: 'file', message: 'file must be CSV or .xlsx' },
      ]);
    return previewText(text);
  }
  // File names inside a zip are stored in plain text: a macro project shows by its name.
  if (bytes.includes('vbaProject.bin'))
    throw new AppError(
      415,
      'workbook_with_macros',
      `${name} contains macros (vbaProject.bin); they are never run here. Save the chart as a plain .xlsx without macros, or as CSV.`,
      [{ path: 'file', message: 'workbook must not contain macros' }],
    );
  const wb = new ExcelJS.Workbook();
  try {
    await wb.xlsx.load(bytes as unknown as ArrayBuffer);
  } catch {
    throw new AppError(415, 'unreadable_workbook', `${name} could not be read as an .xlsx workbook.`, [
      { path: 'file', message: 'workbook could not be read' },
    ]);
  }
  const sheet = wb.worksheets[0];
  if (!sheet)
    throw new AppError(400, 'empty_workbook', `${name} has no worksheet.`, [
      { path: 'file', message: 'workbook has no sheet' },
    ]);
  if (sheet.rowCount > MAX_GRID_ROWS || sheet.columnCount > MAX_GRID_COLUMNS)
    throw new AppError(
      400,
      'chart_too_large',
      `The sheet "${sheet.name}" has ${sheet.rowCount} rows and ${sheet.columnCount} columns; at most ${MAX_GRID_ROWS} rows and ${MAX_GRID_COLUMNS} columns can be read.`,
      [
        {
          path: 'file',
          message: `sheet must be at most ${MAX_GRID_ROWS} rows × ${MAX_GRID_COLUMNS} columns`,
        },
      ],
    );
  const table: RawCell[][] = [];
  const notes: { r: number; c: number; message: string; error: boolean }[] = [];
  sheet.eachRow({ includeEmpty: true }, (row, r) => {
    const line: RawCell[] = [];
    row.eachCell({ includeEmpty: true }, (cell, c) => {
      const v = cell.value;
      let out: RawCell = null;
      if (v === null || v === undefined) out = null;
      else if (typeof v === 'number' || typeof v === 'string') out = v;
      else if ((typeof v === 'object' && 'formula' in v) || (typeof v === 'object' && 'sharedFormula' in v)) {
        const result = (v as { result?: unknown }).result;
        if (typeof result === 'number' || typeof result === 'string') {
          out = result;
          notes.push({
            r: r - 1,
            c: c - 1,
            message: `holds a formula; its stored value ${result} was read, the formula was not calculated`,
            error: false,
          });
        } else {
          notes.push({
            r: r - 1,
            c: c - 1,
            message:
              'holds a formula with no stored value: type the value itself (formulas are never calculated here)',
            error: true,
          });
          out = null;
        }
      } else if (typeof v === 'object' && 'richText' in v)
        out = (v as ExcelJS.CellRichTextValue).richText.map((t) => t.text).join('');
      else if (v instanceof Date) {
        out = v.toISOString().slice(0, 10);
      } else out = String(cell.text ?? '');
      line[c - 1] = out;
    });
    table[r - 1] = line;
  });
  for (let i = 0; i < table.length; i++) table[i] = table[i] ?? [];
  const preview = readChartGrid(table);
  for (const n of notes) {
    const ref = cellRef(n.r, n.c);
    const issue = { ref, row: n.r + 1, column: n.c + 1, message: `${ref}: ${n.message}` };
    const cell = preview.cells[n.r]?.[n.c];
    if (n.error) {
      preview.errors.push(issue);
      preview.grid = null;
      if (cell) Object.assign(cell, { problem: 'error', message: n.message });
    } else {
      preview.warnings.push(issue);
      if (cell && !cell.problem) Object.assign(cell, { problem: 'warning', message: n.message });
    }
  }
  return preview;
}

export async function chartXlsx(grid: ChartGrid, sheetName: string): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Counterpoise';
  const ws = wb.addWorksheet(sheetName.replace(/[\\/?*[\]:]/g, ' ').slice(0, 31) || 'Chart');
  for (const row of gridToTable(grid)) ws.addRow(row.map((c) => (c === '' ? null : c)));
  ws.getColumn(1).width = 36;
  return Buffer.from(await wb.xlsx.writeBuffer());
}

export const chartCsv = gridToCsv;
