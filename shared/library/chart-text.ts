// Chart tables from text: a CSV file, or cells pasted from a spreadsheet (tab-separated) or from a
// CSV. papaparse guesses the delimiter; what it returns goes to readChartGrid, and the table out
// again for export. Pure (no I/O), so the browser and the server read text alike.
import Papa from 'papaparse';
import { gridToTable, type ChartGrid } from './chart-grid';
import { readChartGrid, type ChartPreview } from './chart-reader';

/** Most characters of chart text read (a chart of 300 × 100 cells fits well within it). */
export const MAX_CHART_TEXT = 500_000;

export function tableFromText(text: string): { table: string[][]; error: string | null } {
  if (text.length > MAX_CHART_TEXT)
    return {
      table: [],
      error: `The text has ${text.length} characters; at most ${MAX_CHART_TEXT} can be read`,
    };
  const clean = text.replace(/^\uFEFF/, '');
  const parsed = Papa.parse<string[]>(clean, {
    skipEmptyLines: 'greedy',
    delimitersToGuess: ['\t', ',', ';', '|'],
  });
  const fatal = parsed.errors.find((e) => e.type === 'Quotes');
  if (fatal)
    return {
      table: [],
      error: `Row ${(fatal.row ?? 0) + 1}: ${fatal.message} (a quote opened and never closed)`,
    };
  return { table: parsed.data, error: null };
}

export function previewText(text: string): ChartPreview {
  const { table, error } = tableFromText(text);
  const preview = readChartGrid(table);
  if (error) preview.errors.unshift({ ref: null, row: null, column: null, message: error });
  if (error) preview.grid = null;
  return preview;
}

export function gridToCsv(g: ChartGrid): string {
  return Papa.unparse(gridToTable(g), { newline: '\r\n' }) + '\r\n';
}
