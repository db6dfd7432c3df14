/**
 * Numbers in sentences: rounded for reading, never for storing. Results keep
 * full precision; only the words round.
 */
import { benchUnitLabels, type BenchUnit } from './units';

const MINUS = '\u2212';

function trimZero(text: string): string {
  return text === '-0' || /^-0\.?0*$/.test(text) ? '0' : text;
}

/** A plain number for a sentence: 731.7, 52.25, 0.345 (no trailing zeros). */
export function roundForWords(x: number): string {
  const abs = Math.abs(x);
  const digits = abs >= 100 ? 1 : abs >= 1 ? 2 : 3;
  return trimZero(String(Number(x.toFixed(digits)))).replace('-', MINUS);
}

/** A percentage with one decimal: "2.4 %", "0.6 %". */
export function pctWords(x: number): string {
  return `${trimZero(String(Number(x.toFixed(1)))).replace('-', MINUS)} %`;
}

/** A signed percentage: "+2.4 %", "−2.4 %", "0 %". */
export function signedPctWords(x: number): string {
  const text = pctWords(x);
  return text.startsWith(MINUS) || text.startsWith('0 ') ? text : `+${text}`;
}

/** A value with its unit: "52.25 mm³/stroke", "310 bar". */
export function valueWords(x: number, unit: BenchUnit): string {
  return `${roundForWords(x)} ${benchUnitLabels[unit]}`;
}

/** A signed value with its unit: "+0.7 mm³/stroke", "−12 bar". */
export function signedValueWords(x: number, unit: BenchUnit): string {
  const text = valueWords(x, unit);
  return text.startsWith(MINUS) || text.startsWith('0 ') ? text : `+${text}`;
}

/** A ratio: "2.1 ×". */
export function ratioWords(x: number): string {
  return `${trimZero(String(Number(x.toFixed(1))))} ×`;
}

/** Horsepower for a sentence: whole hp from 10 up, one decimal below. */
export function hpWords(x: number): string {
  const digits = Math.abs(x) >= 10 ? 0 : 1;
  return `${trimZero(String(Number(x.toFixed(digits)))).replace('-', MINUS)} hp`;
}

/** "injector 3", "injectors 3 and 5", "injectors 1, 4 and 6". */
export function injectorsWords(positions: readonly number[]): string {
  if (positions.length === 1) return `injector ${positions[0]}`;
  const head = positions.slice(0, -1).join(', ');
  return `injectors ${head} and ${positions[positions.length - 1]}`;
}

/**
 * A point's label inside a sentence: "Full load" reads "full load", while a
 * label that starts with an acronym ("NOP", "CR 1600") stays as typed.
 */
export function labelInSentence(label: string): string {
  const text = label.trim();
  if (text.length > 1 && /^[A-Z][a-z]/.test(text)) return text[0]!.toLowerCase() + text.slice(1);
  return text;
}

/** First letter upper-case: sentences are built from lower-case phrases. */
export function capitalise(text: string): string {
  return text ? text[0]!.toUpperCase() + text.slice(1) : text;
}
