/**
 * A small PDF reader for the tests of the calculation package: the page count and the text of
 * every page, decoded through the fonts' ToUnicode maps (pdfkit writes embedded-font text as
 * glyph codes). Reads only what pdfkit writes: objects `n 0 obj`, Flate streams, `Tm`, `Tf`,
 * `TJ` with hex strings, `bfrange` arrays and `bfchar` entries.
 */
import { inflateSync } from 'node:zlib';

interface PdfObject {
  dict: string;
  stream: Buffer | null;
}

function objects(pdf: Buffer): Map<number, PdfObject> {
  const text = pdf.toString('latin1');
  const out = new Map<number, PdfObject>();
  const re = /(\d+) 0 obj\s*/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(text))) {
    const start = m.index + m[0].length;
    const end = text.indexOf('endobj', start);
    const body = text.slice(start, end);
    const s = body.indexOf('stream');
    let stream: Buffer | null = null;
    let dict = body;
    if (s >= 0 && body.slice(0, s).trim().endsWith('>>')) {
      dict = body.slice(0, s);
      let from = start + s + 'stream'.length;
      if (text[from] === '\r') from++;
      if (text[from] === '\n') from++;
      const to = text.indexOf('endstream', from);
      let raw = pdf.subarray(from, to);
      if (/\/FlateDecode/.test(dict)) raw = inflateSync(raw);
      stream = raw;
    }
    out.set(Number(m[1]), { dict, stream });
    re.lastIndex = end;
  }
  return out;
}

function unhex(hex: string): string {
  const codes: number[] = [];
  for (let i = 0; i + 4 <= hex.length; i += 4) codes.push(parseInt(hex.slice(i, i + 4), 16));
  return String.fromCharCode(...codes);
}

function cmap(stream: string): Map<number, string> {
  const map = new Map<number, string>();
  for (const block of stream.matchAll(/beginbfrange([\s\S]*?)endbfrange/g)) {
    for (const r of block[1].matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F]+)>\s*(\[[^\]]*\]|<[0-9a-fA-F ]+>)/g)) {
      const lo = parseInt(r[1], 16);
      const hi = parseInt(r[2], 16);
      if (r[3].startsWith('[')) {
        [...r[3].matchAll(/<([0-9a-fA-F ]+)>/g)].forEach((h, i) => map.set(lo + i, unhex(h[1].replace(/ /g, ''))));
      } else {
        const base = parseInt(r[3].slice(1, -1).replace(/ /g, ''), 16);
        for (let c = lo; c <= hi; c++) map.set(c, String.fromCharCode(base + c - lo));
      }
    }
  }
  for (const block of stream.matchAll(/beginbfchar([\s\S]*?)endbfchar/g)) {
    for (const r of block[1].matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F ]+)>/g)) map.set(parseInt(r[1], 16), unhex(r[2].replace(/ /g, '')));
  }
  return map;
}

export interface PdfText {
  pageCount: number;
  /** per page, lines top to bottom; pieces on one line joined by a space */
  pages: string[][];
}

export function readPdf(pdf: Buffer): PdfText {
  const objs = objects(pdf);
  const ref = (dict: string, key: string) => {
    const m = new RegExp(`/${key}\\s+(\\d+) 0 R`).exec(dict);
    return m ? Number(m[1]) : null;
  };
  const root = [...objs.values()].find((o) => /\/Type\s*\/Pages/.test(o.dict));
  const pageCount = Number(/\/Count\s+(\d+)/.exec(root?.dict ?? '')?.[1] ?? 0);
  const pages: string[][] = [];
  for (const page of [...objs.entries()].filter(([, o]) => /\/Type\s*\/Page\b/.test(o.dict)).sort((a, b) => a[0] - b[0])) {
    const resId = ref(page[1].dict, 'Resources');
    const resources = resId !== null ? objs.get(resId)!.dict : page[1].dict;
    const fontBlock = /\/Font\s*<<([^>]*)>>/.exec(resources)?.[1] ?? '';
    const fonts = new Map<string, Map<number, string>>();
    for (const f of fontBlock.matchAll(/\/(\w+)\s+(\d+) 0 R/g)) {
      const font = objs.get(Number(f[2]));
      const tu = font ? ref(font.dict, 'ToUnicode') : null;
      fonts.set(f[1], tu !== null ? cmap(objs.get(tu)!.stream!.toString('latin1')) : new Map());
    }
    const contentId = ref(page[1].dict, 'Contents');
    const content = contentId !== null ? objs.get(contentId)!.stream!.toString('latin1') : '';
    const pieces: { y: number; x: number; text: string }[] = [];
    let font = new Map<number, string>();
    let x = 0;
    let y = 0;
    for (const tok of content.matchAll(/([-\d.]+) ([-\d.]+) Tm|\/(\w+) [\d.]+ Tf|\[([^\]]*)\] TJ/g)) {
      if (tok[1] !== undefined) {
        x = Number(tok[1]);
        y = Number(tok[2]);
      } else if (tok[3] !== undefined) font = fonts.get(tok[3]) ?? new Map();
      else {
        let s = '';
        for (const h of tok[4].matchAll(/<([0-9a-fA-F]*)>/g)) {
          for (let i = 0; i + 4 <= h[1].length; i += 4) s += font.get(parseInt(h[1].slice(i, i + 4), 16)) ?? '';
        }
        pieces.push({ x, y, text: s });
      }
    }
    const lines = new Map<number, { x: number; text: string }[]>();
    for (const p of pieces) {
      const key = Math.round(p.y);
      if (!lines.has(key)) lines.set(key, []);
      lines.get(key)!.push(p);
    }
    pages.push([...lines.entries()].sort((a, b) => b[0] - a[0]).map(([, ps]) => ps.sort((a, b) => a.x - b.x).map((p) => p.text).join(' ')));
  }
  return { pageCount, pages };
}
