import { describe, expect, it } from 'vitest';
import { notANumberMessage, numberToInput, parseNumber, readNumber } from '@shared/numbers';

// The rule is Headroom's own (US English screens): see the header of shared/numbers.ts.
// Expected values are the numbers a person means by the text, written out by hand.

describe('readNumber', () => {
  it.each([
    ['42', 42],
    ['  42 ', 42],
    ['-3', -3],
    ['+3', 3],
    ['\u22123', -3],
    ['.5', 0.5],
    ['-.5', -0.5],
    ['12.', 12],
    ['0', 0],
    ['-0', 0],
    ['007', 7],
    ['1,250.5', 1250.5],
    ['12,345,678', 12345678],
    ['1,250', 1250],
    ['-1,250.25', -1250.25],
  ])('reads what a US user types: %j is %d', (text, value) => {
    expect(readNumber(text)).toEqual({ ok: true, value });
  });

  it.each([
    ['12,5', 12.5],
    ['0,250', 0.25],
    ['1234,5', 1234.5],
    ['12,50', 12.5],
    [',5', 0.5],
    ['47,5', 47.5],
    ['12,', 12],
  ])('reads an unambiguous decimal comma: %j is %d', (text, value) => {
    expect(readNumber(text)).toEqual({ ok: true, value });
  });

  it.each(['', '   ', null, undefined])('reads an empty box (%j) as no number', (text) => {
    expect(readNumber(text)).toEqual({ ok: true, value: null });
  });

  it.each([
    'abc',
    '12abc',
    '1.250,5',
    '1,250,5',
    '1.2.3',
    '1e3',
    'Infinity',
    '.',
    ',',
    '-',
    '--3',
    '12 5',
    '1,25,0',
  ])('refuses %j with a clear message', (text) => {
    const reading = readNumber(text);
    expect(reading.ok).toBe(false);
    expect(reading).toMatchObject({ error: notANumberMessage });
    expect(Number.isNaN(reading.value)).toBe(true);
  });

  it('passes a number through and refuses NaN and infinities', () => {
    expect(readNumber(12.5)).toEqual({ ok: true, value: 12.5 });
    expect(readNumber(Number.NaN).ok).toBe(false);
    expect(readNumber(Number.POSITIVE_INFINITY).ok).toBe(false);
  });
});

describe('parseNumber', () => {
  it('gives the number, null for empty and NaN for garbage (for the schema to name)', () => {
    expect(parseNumber('1,250.5')).toBe(1250.5);
    expect(parseNumber('')).toBeNull();
    expect(parseNumber('twelve')).toBeNaN();
  });
});

describe('numberToInput', () => {
  it('writes a number back as text that reads the same', () => {
    for (const n of [0, 12.5, -3, 1250.5, 0.125]) expect(parseNumber(numberToInput(n))).toBe(n);
    expect(numberToInput(null)).toBe('');
    expect(numberToInput(Number.NaN)).toBe('');
  });
});
