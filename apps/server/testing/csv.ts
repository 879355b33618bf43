import { parse } from 'csv-parse/sync';

/**
 * An export read back by an independent parser (csv-parse), not by the code that wrote it: strict
 * RFC 4180 (every record the same number of columns, quotes closed), a leading BOM dropped.
 */
export function readCsv(text: string): string[][] {
  return parse(text, { bom: true }) as string[][];
}
