// Types for scripts/server-build.mjs (plain ESM so npm start runs it without TypeScript tooling).
export function serverIsStale(): boolean;
export function buildServer(opts?: { force?: boolean; log?: (message: string) => void }): Promise<string>;
