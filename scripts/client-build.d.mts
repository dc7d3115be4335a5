// Types of scripts/client-build.mjs (plain Node so `npm start` needs no TypeScript).
export declare const ROOT: string;
export declare const CLIENT_SOURCES: string[];
export declare const STAMP: string;
export declare function clientDist(root?: string, env?: Record<string, string | undefined>): string;
export declare function clientSourceHash(root?: string): string;
export declare function staleReason(root?: string, dist?: string): string | null;
export declare function clientIsStale(root?: string, dist?: string): boolean;
export declare function buildClient(root?: string, dist?: string, options?: { inherit?: boolean }): void;
export declare function ensureClientBuilt(
  root?: string,
  dist?: string,
  options?: { force?: boolean; inherit?: boolean; log?: (message: string) => void },
): string | null;
