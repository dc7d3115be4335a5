/**
 * Built result payloads kept in memory, by key, up to a byte budget (least recently used
 * first out). A stored run never changes, so the grid payload of a run — 3 MB gzip at 110k
 * members, seconds to build from the stored blobs — is built once per server and then sent
 * as it is to everyone who opens the grid; requests that arrive while it is being built wait
 * for that build instead of starting their own. A failed build is not kept.
 */
export class PayloadCache {
  private readonly kept = new Map<string, Uint8Array>();
  private readonly building = new Map<string, Promise<Uint8Array>>();
  private bytes = 0;
  readonly stats = { built: 0, hits: 0 };

  constructor(private readonly budgetBytes: number) {}

  get(key: string, build: () => Promise<Uint8Array>): Promise<Uint8Array> {
    const hit = this.kept.get(key);
    if (hit) {
      this.stats.hits++;
      this.kept.delete(key);
      this.kept.set(key, hit);
      return Promise.resolve(hit);
    }
    const pending = this.building.get(key);
    if (pending) {
      this.stats.hits++;
      return pending;
    }
    this.stats.built++;
    const p = build().then((bytes) => {
      this.keep(key, bytes);
      return bytes;
    }).finally(() => this.building.delete(key));
    this.building.set(key, p);
    return p;
  }

  /** Keeps a payload built elsewhere (a run builds its grid's with its results). */
  put(key: string, bytes: Uint8Array): void {
    const old = this.kept.get(key);
    if (old) {
      this.kept.delete(key);
      this.bytes -= old.byteLength;
    }
    this.keep(key, bytes);
  }

  private keep(key: string, bytes: Uint8Array): void {
    if (bytes.byteLength > this.budgetBytes) return;
    this.kept.set(key, bytes);
    this.bytes += bytes.byteLength;
    for (const [k, v] of this.kept) {
      if (this.bytes <= this.budgetBytes) break;
      this.kept.delete(k);
      this.bytes -= v.byteLength;
    }
  }

  /** Payloads kept and their bytes. */
  get size(): { entries: number; bytes: number } {
    return { entries: this.kept.size, bytes: this.bytes };
  }
}

/** Grid payloads kept per server and database (GRID_CACHE_MB, default 64; 0 keeps none). */
const grids = new WeakMap<object, PayloadCache>();
export function gridPayloads(database: object): PayloadCache {
  let cache = grids.get(database);
  if (!cache) {
    const mb = Number(process.env.GRID_CACHE_MB ?? 64);
    cache = new PayloadCache((Number.isFinite(mb) && mb >= 0 ? mb : 64) * 1024 * 1024);
    grids.set(database, cache);
  }
  return cache;
}
