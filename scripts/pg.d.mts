// Types for scripts/pg.mjs (plain ESM so it runs before any TypeScript tooling).
export interface PgConfig {
  port: number;
  dataDir: string;
  socketDir: string;
  dataNote: string | null;
  logFile: string;
}
export interface PgOpts {
  db?: string;
  cfg?: PgConfig;
  binDir?: string | null;
}
export const REPO_ROOT: string;
export const APP_ROLE: string;
export const APP_PASSWORD: string;
export const APP_DB: string;
export const CHROMIUM_PATH: string;
export function findPgBinDir(): string | null;
export function ensurePgInstalled(): string;
export function pgConfig(): PgConfig;
export function isPgRunning(cfg?: PgConfig, binDir?: string | null): boolean;
export function psql(sql: string, opts?: PgOpts): string;
export function ensureAppRole(opts?: PgOpts): void;
export function ensureDatabase(name: string, opts?: PgOpts): boolean;
export function dropDatabase(name: string, opts?: PgOpts): void;
export function databaseUrl(db?: string, cfg?: PgConfig): string;
export function ensurePgRunning(): Promise<{ cfg: PgConfig; binDir: string; startedHere: boolean }>;
export function stopPg(cfg?: PgConfig, binDir?: string | null): boolean;
export function otherConnections(opts?: PgOpts): number;
export function ensureChromium(): string;
