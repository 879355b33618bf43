import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { answersOf, type Answer, type AnswerEngine } from './answers.js';

/**
 * Below this many distinct inputs a preview's candidate engine runs on the request's own thread:
 * a worker's message round trip and the copying of inputs and answers cost more than they save.
 */
export const PARALLEL_MIN_INPUTS = 20_000;
/** A worker left idle this long is ended (it holds a copy of an engine). */
const IDLE_MS = 30_000;

/**
 * The worker's code (plain JS, so it runs the same under tsx, Vitest and the built server): it
 * loads one engine module by path and answers batches of input texts in a compact form, outputs
 * as one Float64Array in the calculator's output order (NaN for a withheld value: an output is
 * finite or null), warning codes joined by a space, refusals flagged.
 */
const WORKER_CODE = `
const { parentPort, workerData } = require('node:worker_threads');
const engine = require(workerData.enginePath);
const run = typeof engine.compute === 'function' ? engine.compute : engine.calculate;
const isInputError = (e) => e instanceof Error && e.name === 'CalcInputError' && Array.isArray(e.issues);
parentPort.on('message', ({ calculatorId, texts, outputIds }) => {
  try {
    const n = texts.length;
    const values = new Float64Array(n * outputIds.length);
    const refused = new Uint8Array(n);
    const warnings = new Array(n);
    for (let i = 0; i < n; i++) {
      let res;
      try {
        res = run(calculatorId, JSON.parse(texts[i]));
      } catch (e) {
        if (!isInputError(e)) throw e;
        refused[i] = 1;
        warnings[i] = '';
        continue;
      }
      for (let j = 0; j < outputIds.length; j++) {
        const v = res.outputs[outputIds[j]];
        values[i * outputIds.length + j] = v === null || v === undefined ? NaN : v;
      }
      warnings[i] = res.warnings.map((w) => w.code).join(' ');
    }
    parentPort.postMessage({ values, refused, warnings }, [values.buffer, refused.buffer]);
  } catch (e) {
    parentPort.postMessage({ error: String((e && e.stack) || e) });
  }
});
`;

interface Reply {
  values?: Float64Array;
  refused?: Uint8Array;
  warnings?: string[];
  error?: string;
}

interface Pool {
  workers: Worker[];
  timer?: NodeJS.Timeout;
}
const pools = new Map<string, Pool>();

function poolFor(enginePath: string, size: number): Worker[] {
  let pool = pools.get(enginePath);
  if (!pool) {
    pool = { workers: [] };
    pools.set(enginePath, pool);
  }
  while (pool.workers.length < size) {
    const w = new Worker(WORKER_CODE, { eval: true, workerData: { enginePath } });
    w.unref();
    w.on('error', () => dropWorker(enginePath, w));
    w.on('exit', () => dropWorker(enginePath, w));
    pool.workers.push(w);
  }
  if (pool.timer) clearTimeout(pool.timer);
  pool.timer = setTimeout(() => endPool(enginePath), IDLE_MS);
  pool.timer.unref();
  return pool.workers.slice(0, size);
}

function dropWorker(enginePath: string, w: Worker): void {
  const pool = pools.get(enginePath);
  if (pool) pool.workers = pool.workers.filter((x) => x !== w);
}

function endPool(enginePath: string): void {
  const pool = pools.get(enginePath);
  pools.delete(enginePath);
  for (const w of pool?.workers ?? []) void w.terminate();
}

/** End every worker now (tests, shutdown). */
export async function endAnswerWorkers(): Promise<void> {
  const all = [...pools.keys()];
  await Promise.all(
    all.flatMap((p) => {
      const pool = pools.get(p);
      pools.delete(p);
      if (pool?.timer) clearTimeout(pool.timer);
      return (pool?.workers ?? []).map((w) => w.terminate());
    }),
  );
}

function ask(w: Worker, message: { calculatorId: string; texts: string[]; outputIds: string[] }): Promise<Reply> {
  return new Promise((resolve, reject) => {
    const onMessage = (reply: Reply) => {
      w.off('error', onError);
      if (reply.error) reject(new Error(`answer worker: ${reply.error}`));
      else resolve(reply);
    };
    const onError = (e: unknown) => {
      w.off('message', onMessage);
      reject(e instanceof Error ? e : new Error(String(e)));
    };
    w.once('message', onMessage);
    w.once('error', onError);
    w.postMessage(message);
  });
}

function decode(reply: Reply, outputIds: readonly string[]): (Answer | null)[] {
  const { values, refused, warnings } = reply as Required<Reply>;
  const k = outputIds.length;
  return Array.from(refused, (r, i) => {
    if (r) return null;
    const outputs: Record<string, number | null> = {};
    for (let j = 0; j < k; j++) {
      const v = values[i * k + j] as number;
      outputs[outputIds[j] as string] = Number.isNaN(v) ? null : v;
    }
    const codes = warnings[i] as string;
    return { outputs, warnings: codes ? codes.split(' ') : [] };
  });
}

/**
 * The engine's answers for these input texts, spread over this thread and worker threads (each
 * loads the engine module at `enginePath` itself) when there are enough of them and more than one
 * core; else on this thread alone. The same answers as `answersOf` either way.
 */
export async function answersSpread(
  engine: AnswerEngine,
  enginePath: string | null,
  calculatorId: string,
  texts: readonly string[],
  threads = availableParallelism(),
): Promise<(Answer | null)[]> {
  const outputIds = engine.getCalculator(calculatorId)?.outputs.map((o) => o.id);
  if (!enginePath || !outputIds || threads < 2 || texts.length < PARALLEL_MIN_INPUTS)
    return answersOf(engine, calculatorId, texts);
  const workers = poolFor(enginePath, threads - 1);
  // Equal shares; this thread takes the first while the workers run theirs.
  const share = Math.ceil(texts.length / threads);
  const asked = workers.map((w, i) =>
    ask(w, { calculatorId, texts: texts.slice((i + 1) * share, (i + 2) * share), outputIds }),
  );
  const mine = answersOf(engine, calculatorId, texts.slice(0, share));
  const theirs = await Promise.all(asked);
  return mine.concat(...theirs.map((r) => decode(r, outputIds)));
}
