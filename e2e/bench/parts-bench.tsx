/**
 * The benchmark page: the real ledger component (toolbar, TanStack table, grouping) with
 * generated parts, driven by scripts/bench-parts-table.ts through window.__bench.
 * Every timing is from the user's action to the first frame painted after React has
 * committed the result.
 */
import '@fontsource/source-sans-3/400.css';
import '@fontsource/source-sans-3/600.css';
import '@fontsource/source-sans-3/700.css';
import '@/styles.css';
import { StrictMode } from 'react';
import { createRoot, type Root } from 'react-dom/client';
import { flushSync } from 'react-dom';
import type { Part } from '@shared/schemas/parts';
import { PartsLedger } from '@/features/parts/components/parts-ledger';
import type { LedgerActions } from '@/features/parts/components/parts-columns';
import { generateParts } from './generate-parts';

const actions: LedgerActions = {
  currency: 'USD',
  onStatusChange: async () => undefined,
  onEdit: () => undefined,
  onDelete: () => undefined,
};

let root: Root | null = null;

const nextPaint = () =>
  new Promise<void>((resolve) => requestAnimationFrame(() => setTimeout(resolve, 0)));

async function until(done: () => boolean, what: string) {
  const start = performance.now();
  while (!done()) {
    if (performance.now() - start > 30_000) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 0));
  }
}

function shownText() {
  return document.querySelector('[aria-live="polite"]')?.textContent ?? '';
}

function sortButton(label: string) {
  const button = [...document.querySelectorAll<HTMLButtonElement>('thead th button')].find(
    (b) => b.textContent?.trim() === label,
  );
  if (!button) throw new Error(`no sortable column "${label}"`);
  return button;
}

/** Types into a React-controlled input as a person would (the input event React listens to). */
function setInput(el: HTMLInputElement | HTMLSelectElement, value: string, event: string) {
  const proto =
    el instanceof HTMLSelectElement ? HTMLSelectElement.prototype : HTMLInputElement.prototype;
  Object.getOwnPropertyDescriptor(proto, 'value')!.set!.call(el, value);
  el.dispatchEvent(new Event(event, { bubbles: true }));
}

const bench = {
  /** Mounts the ledger with n parts; returns ms to the first painted frame. */
  async mount(n: number, grouped: boolean): Promise<number> {
    window.localStorage.setItem('headroom:parts:group-by-category', grouped ? '1' : '0');
    window.localStorage.removeItem('headroom:parts:columns');
    root?.unmount();
    const parts: Part[] = generateParts(n);
    const container = document.getElementById('root')!;
    const start = performance.now();
    root = createRoot(container);
    flushSync(() =>
      root!.render(
        <StrictMode>
          <PartsLedger parts={parts} actions={actions} layout="table" moneyFallback="full" />
        </StrictMode>,
      ),
    );
    await until(() => document.querySelectorAll('tbody tr').length > 0, 'rows');
    await nextPaint();
    return performance.now() - start;
  },

  /** Clicks a column header once (ascending → descending → unsorted). */
  async sort(label: string): Promise<number> {
    const th = sortButton(label).closest('th')!;
    const before = th.getAttribute('aria-sort');
    const start = performance.now();
    sortButton(label).click();
    await until(() => th.getAttribute('aria-sort') !== before, 'the sort');
    await nextPaint();
    return performance.now() - start;
  },

  /** Types a whole search at once (as a paste would) and waits for the list to follow. */
  async search(text: string): Promise<number> {
    const input = document.getElementById('parts-search') as HTMLInputElement;
    const before = shownText();
    const start = performance.now();
    setInput(input, text, 'input');
    await until(() => shownText() !== before, 'the search');
    await nextPaint();
    return performance.now() - start;
  },

  /** Chooses a status in the Status filter ('' for all). */
  async status(value: string): Promise<number> {
    const select = document.getElementById('parts-status') as HTMLSelectElement;
    const before = shownText();
    const start = performance.now();
    setInput(select, value, 'change');
    await until(() => shownText() !== before, 'the status filter');
    await nextPaint();
    return performance.now() - start;
  },

  rows: () => document.querySelectorAll('tbody tr').length,
  shown: shownText,
};

declare global {
  interface Window {
    __bench: typeof bench;
  }
}
window.__bench = bench;
document.title = 'Parts table benchmark (ready)';
