// Load chart rows pasted from a spreadsheet: tab-, comma- or semicolon-separated, with or
// without a header row. Columns are radius, boom length and capacity in that order unless
// a header names them (and perhaps their units: "Capacity (kip)").
import { unitInText } from '@/lib/input-units';

export type PastedRow = { radius: number; boomLength: number; capacity: number };
export type PasteResult = {
  rows: PastedRow[];
  skippedHeader: boolean;
  units: { radius: string | null; boomLength: string | null; capacity: string | null };
  problems: string[];
};

function splitLine(line: string): string[] {
  if (line.includes('\t')) return line.split('\t').map((cell) => cell.trim());
  if (line.includes(';')) return line.split(';').map((cell) => cell.trim());
  return line.split(',').map((cell) => cell.trim());
}

function toNumber(cell: string, separatedByTabs: boolean): number {
  // In tab-separated text a comma groups thousands ("12,000"); elsewhere it separated cells.
  const text = separatedByTabs ? cell.replace(/,(?=\d{3}\b)/g, '') : cell;
  return text === '' ? Number.NaN : Number(text.replace(/\s/g, ''));
}

export function parseChartRows(text: string): PasteResult {
  const lines = text
    .split(/\r?\n/)
    .map((line) => line.trim())
    .filter((line) => line !== '');
  const result: PasteResult = {
    rows: [],
    skippedHeader: false,
    units: { radius: null, boomLength: null, capacity: null },
    problems: [],
  };
  if (lines.length === 0) return result;

  let order = [0, 1, 2];
  const first = splitLine(lines[0]);
  const tabs = lines[0].includes('\t');
  if (first.some((cell) => cell !== '' && Number.isNaN(toNumber(cell, tabs)))) {
    result.skippedHeader = true;
    lines.shift();
    const find = (pattern: RegExp) => first.findIndex((cell) => pattern.test(cell.toLowerCase()));
    const radius = find(/radius|rad\b|^r\b/);
    const boom = find(/boom|length|^l\b/);
    const capacity = find(/capac|rated|load|cap\b/);
    if (radius >= 0 && boom >= 0 && capacity >= 0) order = [radius, boom, capacity];
    result.units = {
      radius: unitInText(first[order[0]] ?? '', 'length'),
      boomLength: unitInText(first[order[1]] ?? '', 'length'),
      capacity: unitInText(first[order[2]] ?? '', 'weight'),
    };
  }

  lines.forEach((line, index) => {
    const cells = splitLine(line);
    const [radius, boomLength, capacity] = order.map((column) =>
      toNumber(cells[column] ?? '', line.includes('\t')),
    );
    if ([radius, boomLength, capacity].some((n) => !Number.isFinite(n))) {
      const lineNumber = index + 1 + (result.skippedHeader ? 1 : 0);
      result.problems.push(
        `Line ${lineNumber} (“${line.slice(0, 40)}”) does not have three numbers; it was left out.`,
      );
      return;
    }
    result.rows.push({ radius, boomLength, capacity });
  });
  return result;
}
