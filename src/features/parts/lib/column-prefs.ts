import type { ColumnVisibilityState } from '@tanstack/react-table';

const columnsKey = 'headroom:parts:columns';
const groupingKey = 'headroom:parts:group-by-category';

/**
 * The ledger's column choice and grouping, remembered in this browser. A bad or missing
 * entry simply means the defaults; storage can be unavailable (private mode, quota).
 */
export function loadColumnVisibility(defaults: ColumnVisibilityState): ColumnVisibilityState {
  try {
    const raw = window.localStorage.getItem(columnsKey);
    if (!raw) return defaults;
    const saved: unknown = JSON.parse(raw);
    if (!saved || typeof saved !== 'object' || Array.isArray(saved)) return defaults;
    const merged: ColumnVisibilityState = { ...defaults };
    for (const [id, visible] of Object.entries(saved)) {
      if (typeof visible === 'boolean') merged[id] = visible;
    }
    return merged;
  } catch {
    return defaults;
  }
}

export function saveColumnVisibility(state: ColumnVisibilityState): void {
  try {
    window.localStorage.setItem(columnsKey, JSON.stringify(state));
  } catch {
    // Not remembered this time; the choice still applies until the page is left.
  }
}

export function loadGrouped(fallback: boolean): boolean {
  try {
    const raw = window.localStorage.getItem(groupingKey);
    return raw === null ? fallback : raw === '1';
  } catch {
    return fallback;
  }
}

export function saveGrouped(grouped: boolean): void {
  try {
    window.localStorage.setItem(groupingKey, grouped ? '1' : '0');
  } catch {
    // See saveColumnVisibility.
  }
}
