/**
 * Headroom's users and demo are American (issue 20): words on screen and in mail are US
 * English ("labor", "center", "liter"). Checked on the text people read — string literals
 * and JSX text in the client, the shared labels and messages, the server's mails and the
 * demo data — not on identifiers: API keys such as `labourCents` and the CSV's `labour`
 * column stay as they are. shared/dyno is left to the dyno work under way there (its
 * working labels still say "litre" and "vapour"); see the field-fixes report.
 */
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const root = path.resolve(import.meta.dirname, '../..');
const folders = [
  'src',
  'shared/schemas',
  'shared/install-log',
  'shared/ledger',
  'shared/bench',
  'server/features',
  'db/seeds',
];
const british =
  /\b(labour|colour(?:s|ed)?|centre(?:s|d)?|litres?|metres?|cancell(?:ed|ing)|grey|behaviour|organis(?:e|ed|ation)|analys(?:e|ed)|favourite|tyres?|whilst)\b/i;

function files(dir: string): string[] {
  return fs.readdirSync(path.join(root, dir), { withFileTypes: true }).flatMap((e) => {
    const rel = path.join(dir, e.name);
    if (e.isDirectory()) return files(rel);
    return /\.(ts|tsx)$/.test(e.name) ? [rel] : [];
  });
}

/** The text people read: string and template literals, and JSX text, with comments left out. */
function readableText(source: string): string[] {
  const code = source.replace(/\/\*[\s\S]*?\*\//g, '').replace(/(^|[^:'"`])\/\/.*$/gm, '$1');
  const strings = [
    ...code.matchAll(/'(?:[^'\\\n]|\\.)*'|"(?:[^"\\\n]|\\.)*"|`(?:[^`\\]|\\.)*`/g),
  ].map((m) => m[0]);
  const jsxText = [...code.matchAll(/>([^<>{}]*[A-Za-z][^<>{}]*)</g)].map((m) => m[1]);
  // Import paths and CSV column keys are identifiers, not words on screen.
  return [...strings, ...jsxText].filter(
    (s) => !/^['"`]\.{0,2}\//.test(s) && !/^['"]labour['"]$/.test(s),
  );
}

describe('US English on screen', () => {
  it('uses US spelling in every string people read', () => {
    const found: string[] = [];
    for (const file of folders.flatMap(files)) {
      for (const text of readableText(fs.readFileSync(path.join(root, file), 'utf8'))) {
        const m = british.exec(text);
        if (m) found.push(`${file}: “${m[0]}” in ${text.slice(0, 80)}`);
      }
    }
    expect(found).toEqual([]);
  });
});
