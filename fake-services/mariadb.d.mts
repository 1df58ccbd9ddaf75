export function ensureMariaDBInstalled(log?: (m: string) => void): void;
export function isMariaDBRunning(dataDir: string): boolean;
export function startMariaDB(o: {
  dataDir: string;
  port: number;
  database?: string;
  user?: string;
  password?: string;
  log?: (m: string) => void;
}): Promise<{ port: number; socket: string; url: string; pid: number | null; alreadyRunning: boolean }>;
export function stopMariaDB(o: { dataDir: string }): Promise<boolean>;
export function runRootSql(o: { dataDir: string }, sql: string): string;
