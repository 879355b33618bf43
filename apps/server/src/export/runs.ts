import type { Sequelize } from 'sequelize';
import type { Widget } from '../db/models/index.js';
import { runPrinter, valuesCell, type RunPrinter } from '../runs/present.js';
import { csvText, keysetCsv } from './csv.js';
import { selectRows } from './rows.js';

/** Rows read per query when exporting runs: one round trip per this many lines, never all of them at once. */
export const EXPORT_CHUNK = 1000;

export type ExportWidget = Pick<Widget, 'id' | 'name' | 'calculatorId' | 'settings'>;

/**
 * The columns of `runs r` a runs export reads, in the order `runsCsv` takes them. The visitor's
 * result goes whole: the export parses it for its outputs, which costs the server a microsecond or
 * two, where MariaDB's JSON_EXTRACT cost about eight in the database per row (two thirds of the
 * database's time for the chunk query in `ANALYZE FORMAT=JSON`).
 */
export const EXPORT_COLUMNS = `r.id, r.created_at, r.widget_id, r.calculator_id, r.origin, r.page_url, r.\`release\`,
  r.unit_system, r.inputs, r.client_result, r.warning_codes, r.agreed`;

/**
 * The request a run led to, looked up by the query, one probe of the leads' (run, organisation,
 * id) key per run: about 60 % of the database's time for a chunk once the JSON_EXTRACT was gone.
 * Only for an organisation with more linked requests than LINKED_LEADS_READ_WHOLE.
 */
export const EXPORT_LEAD_COLUMN = `(SELECT MIN(l.id) FROM leads l WHERE l.run_id = r.id AND l.organization_id = r.organization_id) AS lead_id`;

/**
 * Up to this many requests linked to runs, an export reads them all first (one query, a map from
 * run to its first request: about 5 MB at the limit, however many runs are exported) instead of
 * looking one up per run. Requests are a small share of runs (0.4 % in the benchmark's year).
 */
export const LINKED_LEADS_READ_WHOLE = 50_000;

/** One row of EXPORT_COLUMNS (and EXPORT_LEAD_COLUMN, when the query looks the lead up) as `selectRows` reads it. */
type ExportRow = [
  id: string,
  createdAt: string,
  widgetId: number,
  calculatorId: string,
  origin: string,
  pageUrl: string | null,
  release: string,
  unitSystem: 'si' | 'us',
  inputs: string,
  clientResult: string,
  warningCodes: string,
  agreed: number,
  leadId?: number | bigint | null,
];

/**
 * The first request of each of the organisation's runs that has one, or null when there are more
 * than `limit` of them (the export then looks them up per run). A run's own request is never
 * older than it, and the lead a run shows is its lowest id, as the runs list shows it.
 */
async function linkedLeads(
  reads: Sequelize,
  orgId: number,
  limit: number,
): Promise<Map<string, number> | null> {
  const rows = await selectRows(
    reads,
    `SELECT l.run_id, MIN(l.id) FROM leads l WHERE l.organization_id = ? AND l.run_id IS NOT NULL
     GROUP BY l.run_id LIMIT ${limit + 1}`,
    [orgId],
  );
  if (rows.length > limit) return null;
  return new Map(rows.map(([run, lead]) => [String(run), Number(lead)]));
}

export const RUNS_CSV_HEADER = [
  'Time (UTC)',
  'Run',
  'Widget ID',
  'Widget',
  'Calculator',
  'Inputs',
  'Outputs',
  'Units',
  'Warnings',
  'Site',
  'Page',
  'Release',
  'Agreed',
  'Lead',
] as const;

/** A DATETIME(3) as MariaDB writes it (UTC here, `2026-01-10 08:00:00.000`) in ISO 8601, as `toISOString` writes it. */
const isoOf = (at: string): string => `${at.slice(0, 10)}T${at.slice(11)}Z`;

/**
 * What one widget's runs print as in one unit system, worked out once: the printer of its inputs
 * and outputs, and the cells that are the same on each of its runs, already escaped.
 */
interface WidgetCells {
  printer: RunPrinter;
  /** `,<widget id>,<widget name>,<calculator title>,` */
  middle: string;
  /** `,<unit system>,` */
  system: string;
}

/**
 * A runs export as CSV text, a chunk at a time: `page(cursor)` is the chunk query (EXPORT_COLUMNS of
 * up to EXPORT_CHUNK runs after the cursor, in the export's order), read through `selectRows`. The
 * bytes are what `csvRow` writes for the cells of each run, built without the cells: per row, the
 * texts the database sent, JSON parsed once, and the widget's constant cells escaped once.
 */
export async function* runsCsv(opts: {
  reads: Sequelize;
  orgId: number;
  widgets: Map<number, ExportWidget>;
  /** The chunk query; `leadInQuery` asks for EXPORT_LEAD_COLUMN after EXPORT_COLUMNS. */
  page: (cursor: [string, string] | null, leadInQuery: boolean) => { sql: string; params: unknown[] };
  /** LINKED_LEADS_READ_WHOLE unless a test wants the other way. */
  linkedLeadsLimit?: number;
}): AsyncGenerator<string> {
  const { widgets } = opts;
  const leads = await linkedLeads(opts.reads, opts.orgId, opts.linkedLeadsLimit ?? LINKED_LEADS_READ_WHOLE);
  // Each widget's cells are made once per unit system and serve all of its runs: the units,
  // conversions, labels and escaping are not worked out again for every row.
  const made = new Map<string, WidgetCells>();
  const cellsOf = (widgetId: number, calculatorId: string, unitSystem: 'si' | 'us'): WidgetCells => {
    const w = widgets.get(widgetId);
    const system = w?.settings.units.system ?? unitSystem;
    const key = `${widgetId}|${calculatorId}|${system}`;
    let c = made.get(key);
    if (!c) {
      const printer = runPrinter(calculatorId, w?.settings ?? { inputs: {} }, system);
      const name = w?.name ?? `Widget ${widgetId}`;
      c = {
        printer,
        middle: `,${widgetId},${csvText(name)},${csvText(printer.title)},`,
        system: `,${csvText(system)},`,
      };
      made.set(key, c);
    }
    return c;
  };

  const records = (rows: ExportRow[]): string => {
    let out = '';
    for (const row of rows) {
      const c = cellsOf(Number(row[2]), row[3], row[7]);
      const p = c.printer;
      const inputs = JSON.parse(row[8]) as Record<string, number | string>;
      const outputs =
        (JSON.parse(row[9]) as { outputs?: Record<string, number | null> | null }).outputs ?? {};
      const warnings = row[10] === '[]' ? '' : csvText((JSON.parse(row[10]) as string[]).join(' '));
      const leadId = leads ? leads.get(row[0]) : row[12];
      const lead = leadId === null || leadId === undefined ? '' : String(Number(leadId));
      out +=
        `${isoOf(row[1])},${csvText(row[0])}${c.middle}${csvText(valuesCell(p.inputs(inputs)))},` +
        `${csvText(valuesCell(p.outputs(outputs)))}${c.system}${warnings},${csvText(row[4])},` +
        `${row[5] === null ? '' : csvText(row[5])},${csvText(row[6])},${Number(row[11]) ? 'yes' : 'no'},${lead}\r\n`;
    }
    return out;
  };

  yield* keysetCsv<ExportRow, [string, string]>({
    header: RUNS_CSV_HEADER,
    chunk: EXPORT_CHUNK,
    page: async (cursor) => {
      const q = opts.page(cursor, !leads);
      return (await selectRows(opts.reads, q.sql, q.params)) as ExportRow[];
    },
    // The time as MariaDB wrote it is already the DATETIME(3) literal the next chunk starts after.
    cursor: (last) => [last[1], last[0]],
    records,
  });
}
