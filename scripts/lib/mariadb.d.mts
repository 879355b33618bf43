export interface MariaDBInstance {
  dir: string;
  port: number;
  datadir: string;
  socket: string;
  pidFile: string;
  logFile: string;
}
export function ensureMariaDBInstalled(): void;
export function instance(dir: string, port: number): MariaDBInstance;
export function sql(inst: MariaDBInstance, statements: string): string;
export function startMariaDB(
  inst: MariaDBInstance,
  opts?: { quiet?: boolean; args?: string[] },
): Promise<number>;
export function stopMariaDB(inst: MariaDBInstance, opts?: { quiet?: boolean }): Promise<void>;
export function ensureDatabase(
  inst: MariaDBInstance,
  opts: { database: string; user: string; password: string; allDatabases?: boolean; alsoPattern?: string },
): void;
