// The tables chunk: a table input (typed, pasted or read from a CSV file) and the chart of its
// result. Only a calculator with a table input fetches it (`lazy-tables.ts`), so no other
// calculator's first flight carries it.
export { TableField } from './tables/TableField.js';
export { ReadingsChart } from './tables/Chart.js';
export { default as css } from './tables/tables.css?inline';
