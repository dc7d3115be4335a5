/**
 * Task data and results as JSON for Redis: byte arrays (Uint8Array, Buffer) and other typed
 * arrays become `{ $bytes: base64, $type }` and come back as the same kind of array.
 */
const TYPED: Record<string, new (buffer: ArrayBuffer) => ArrayBufferView> = {
  Uint8Array, Int8Array, Uint16Array, Int16Array, Uint32Array, Int32Array, Float32Array, Float64Array,
};

export function encodeForQueue(value: unknown): string {
  return JSON.stringify(value, function (this: unknown, key: string, v: unknown) {
    // JSON.stringify has already turned a Buffer into { type: 'Buffer', data }: look at the holder's own value
    const raw = (this as Record<string, unknown>)[key];
    if (ArrayBuffer.isView(raw) && !(raw instanceof DataView)) {
      const bytes = Buffer.from(raw.buffer, raw.byteOffset, raw.byteLength);
      const type = raw instanceof Buffer ? 'Uint8Array' : raw.constructor.name;
      return { $bytes: bytes.toString('base64'), $type: type in TYPED ? type : 'Uint8Array' };
    }
    return v;
  });
}

export function decodeFromQueue<T>(text: string): T {
  return JSON.parse(text, (_key, v: unknown) => {
    if (v && typeof v === 'object' && '$bytes' in v && typeof (v as { $bytes: unknown }).$bytes === 'string') {
      const { $bytes, $type } = v as { $bytes: string; $type: string };
      const bytes = Buffer.from($bytes, 'base64');
      if ($type === 'Uint8Array') return new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength);
      const copy = bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
      return new (TYPED[$type] ?? Uint8Array)(copy);
    }
    return v;
  }) as T;
}
