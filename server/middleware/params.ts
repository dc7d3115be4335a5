/** Route parameter helpers. */
import { notFound } from '../errors/app-error.js';

/** A positive integer id from a route parameter; anything else is 404 ("Project abc not found"). */
export function parseId(raw: string | string[] | undefined, noun: string): number {
  const text = (Array.isArray(raw) ? raw[0] : raw) ?? '';
  if (!/^[1-9][0-9]{0,14}$/.test(text)) throw notFound(`${noun} ${text} not found`);
  return Number(text);
}
