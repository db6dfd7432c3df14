import { useRef, type ClipboardEvent, type KeyboardEvent } from 'react';
import type { UseFormRegister } from 'react-hook-form';
import { parsePastedGrid, readBenchCell } from '@shared/bench';
import type { InjectorFlag } from '@shared/schemas/bench';
import { cn } from '@/components/ui/cn';
import { flagShort, sortedFlags, unitText } from '../lib/format';
import type { PointForm, SheetForm } from '../lib/sheet-form';

export type CellKey = `${number}-${number}`;
/** `${point}-${row}` → what is wrong with that cell (typed text or the schema). */
export type CellMessages = Map<CellKey, string>;

type Heading = Pick<PointForm, 'label' | 'unit'>;

export type PasteReport = { text: string; tone: 'ok' | 'error'; problems: string[] };

/** The raw cells of a pasted block, split exactly as parsePastedGrid splits them. */
function pastedCells(text: string): string[][] {
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
  while (lines.length && lines[lines.length - 1]!.trim() === '') lines.pop();
  while (lines.length && lines[0]!.trim() === '') lines.shift();
  const tabbed = lines.some((l) => l.includes('\t'));
  return lines.map((l) =>
    tabbed ? l.split('\t') : l.trim() === '' ? [] : l.trim().split(/[ \u00a0]+/),
  );
}

/**
 * The values of a sheet as a grid: a row per injector position, a column per test point,
 * for reading values off a bench. Enter and Tab go down the column (to the top of the next
 * column at the bottom), Shift goes back up; the arrow keys move too. A block pasted from a
 * spreadsheet fills the grid from the cell it is pasted into, rows down the injectors and
 * columns across the points.
 */
export function ValueGrid({
  headings,
  cylinders,
  register,
  setCell,
  messages,
  flags,
  onPasted,
}: {
  headings: Heading[];
  cylinders: number;
  register: UseFormRegister<SheetForm>;
  setCell: (point: number, row: number, value: string) => void;
  messages: CellMessages;
  /** The live preview's flags per cell. */
  flags: Map<CellKey, InjectorFlag[]>;
  onPasted: (report: PasteReport) => void;
}) {
  const tableRef = useRef<HTMLTableElement>(null);
  const cols = headings.length;

  const cellAt = (col: number, row: number) =>
    tableRef.current?.querySelector<HTMLInputElement>(
      `input[data-col="${col}"][data-row="${row}"]`,
    );

  function position(target: EventTarget): { col: number; row: number } | null {
    const el = target as HTMLElement;
    if (!(el instanceof HTMLInputElement) || el.dataset.col === undefined) return null;
    return { col: Number(el.dataset.col), row: Number(el.dataset.row) };
  }

  function focus(col: number, row: number) {
    const el = cellAt(col, row);
    if (!el) return false;
    el.focus();
    el.select();
    return true;
  }

  function onKeyDown(e: KeyboardEvent<HTMLTableElement>) {
    const at = position(e.target);
    if (!at) return;
    const input = e.target as HTMLInputElement;
    const { col, row } = at;
    const down = () =>
      row + 1 < cylinders ? [col, row + 1] : col + 1 < cols ? [col + 1, 0] : null;
    const up = () => (row > 0 ? [col, row - 1] : col > 0 ? [col - 1, cylinders - 1] : null);
    let next: number[] | null = null;
    if (e.key === 'Enter' || e.key === 'Tab') {
      next = e.shiftKey ? up() : down();
      // Tab past the last (or first) cell leaves the grid as usual; Enter stays.
      if (!next && e.key === 'Tab') return;
      e.preventDefault();
    } else if (e.key === 'ArrowDown' && row + 1 < cylinders) next = [col, row + 1];
    else if (e.key === 'ArrowUp' && row > 0) next = [col, row - 1];
    else if (
      e.key === 'ArrowRight' &&
      col + 1 < cols &&
      input.selectionStart === input.value.length &&
      input.selectionEnd === input.value.length
    )
      next = [col + 1, row];
    else if (
      e.key === 'ArrowLeft' &&
      col > 0 &&
      input.selectionStart === 0 &&
      input.selectionEnd === 0
    )
      next = [col - 1, row];
    if (next) {
      e.preventDefault();
      focus(next[0]!, next[1]!);
    }
  }

  function onPaste(e: ClipboardEvent<HTMLTableElement>) {
    const at = position(e.target);
    if (!at) return;
    const text = e.clipboardData.getData('text/plain');
    // One value goes into the cell as typed text would.
    if (!/[\t\r\n]/.test(text.trim()) && !/\S\s+\S/.test(text.trim())) return;
    e.preventDefault();
    let raw = pastedCells(text);
    const parsed = parsePastedGrid(text);
    let errors = parsed.errors.filter((x) => x.row !== null);
    let skippedHeading = false;
    // A first row of words only (the spreadsheet's headings) is left out.
    const first = raw[0] ?? [];
    if (
      raw.length > 1 &&
      first.some((c) => c.trim() !== '') &&
      first.every((c) => c.trim() === '' || !readBenchCell(c).ok)
    ) {
      raw = raw.slice(1);
      errors = errors.filter((x) => x.row !== 1).map((x) => ({ ...x, row: x.row! - 1 }));
      skippedHeading = true;
    }
    const bad = new Set(errors.map((x) => `${x.row}-${x.column}`));
    let placed = 0;
    let outside = 0;
    raw.forEach((cells, r) => {
      cells.forEach((cell, c) => {
        const row = at.row + r;
        const col = at.col + c;
        if (row >= cylinders || col >= cols) {
          if (cell.trim() !== '') outside += 1;
          return;
        }
        const reading = readBenchCell(cell);
        setCell(
          col,
          row,
          bad.has(`${r + 1}-${c + 1}`) || !reading.ok
            ? cell.trim()
            : reading.value === null
              ? ''
              : String(reading.value),
        );
        placed += 1;
      });
    });
    const problems = errors
      .filter((x) => at.row + x.row! - 1 < cylinders && at.col + x.column! - 1 < cols)
      .map((x) => {
        const col = at.col + x.column! - 1;
        return `Injector ${at.row + x.row!}, ${headings[col]?.label || `point ${col + 1}`}: ${x.message}`;
      });
    if (outside) {
      problems.push(
        `${outside} value${outside === 1 ? ' was' : 's were'} outside the grid and left out (more injectors than the build’s ${cylinders} cylinders, or more columns than test points)`,
      );
    }
    const rows = raw.length;
    const width = Math.max(0, ...raw.map((r) => r.length));
    onPasted({
      tone: problems.length ? 'error' : 'ok',
      text: `Pasted ${rows} row${rows === 1 ? '' : 's'} × ${width} column${width === 1 ? '' : 's'} from injector ${at.row + 1}, ${headings[at.col]?.label ?? ''}${skippedHeading ? ' (the heading row was left out)' : ''}: ${placed} cell${placed === 1 ? '' : 's'} filled.`,
      problems,
    });
  }

  const positions = Array.from({ length: cylinders }, (_, i) => i);
  // One unit for every column is said once, not squeezed under each heading.
  const oneUnit = headings.length > 0 && headings.every((h) => h.unit === headings[0]!.unit);
  return (
    <div className="-mx-4 overflow-x-auto px-4 sm:mx-0 sm:px-0">
      {oneUnit && (
        <p className="mb-1 text-sm text-muted">All values in {unitText(headings[0]!.unit)}.</p>
      )}
      <table
        ref={tableRef}
        onKeyDown={onKeyDown}
        onPaste={onPaste}
        // Equal columns across the width, each at least 3.5rem: five points fit a phone's 390 px,
        // more scroll sideways.
        className="w-full table-fixed border-collapse"
        style={{ minWidth: `${2.25 + cols * 3.5}rem` }}
        aria-label="Values by injector and test point"
      >
        <colgroup>
          <col style={{ width: '2.25rem' }} />
          {headings.map((_, col) => (
            <col key={col} />
          ))}
        </colgroup>
        <thead>
          <tr>
            <th
              scope="col"
              className="w-9 px-1 pb-1 text-left align-bottom text-xs font-semibold text-muted"
            >
              Inj.
            </th>
            {headings.map((h, col) => (
              <th key={col} scope="col" className="px-0.5 pb-1 text-left align-bottom">
                <span className="block text-sm leading-tight font-bold break-words">
                  {h.label || `Point ${col + 1}`}
                </span>
                {!oneUnit && (
                  <span className="block text-xs font-normal break-words text-muted">
                    {unitText(h.unit).replace('/', '/\u200b')}
                  </span>
                )}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {positions.map((row) => (
            <tr key={row}>
              <th scope="row" className="px-1 text-left font-bold tabular-nums">
                {row + 1}
              </th>
              {headings.map((h, col) => {
                const key: CellKey = `${col}-${row}`;
                const message = messages.get(key);
                const cellFlags = sortedFlags(flags.get(key) ?? []);
                const described = message || cellFlags.length ? `cell-note-${key}` : undefined;
                return (
                  <td key={col} className="px-0.5 py-0.5">
                    <input
                      {...register(`points.${col}.values.${row}` as const)}
                      data-col={col}
                      data-row={row}
                      type="text"
                      size={5}
                      inputMode="decimal"
                      autoComplete="off"
                      enterKeyHint="next"
                      aria-label={`Injector ${row + 1}, ${h.label || `point ${col + 1}`}`}
                      aria-invalid={message ? true : undefined}
                      aria-describedby={described}
                      onFocus={(e) => e.target.select()}
                      className={cn(
                        'block min-h-11 w-full rounded border px-1 text-right text-base tabular-nums',
                        message
                          ? 'border-over bg-white ring-2 ring-over/40'
                          : cellFlags.length
                            ? 'border-over/70 bg-over-soft text-[#7d1f17]'
                            : 'border-rule-strong bg-white',
                      )}
                    />
                    {described && (
                      <span id={described} className="sr-only">
                        {message ?? `Preview: ${cellFlags.map((f) => flagShort[f]).join(', ')}`}
                      </span>
                    )}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
