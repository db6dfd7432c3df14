/** Row → record helpers shared by the install log's repositories. */
import type { Person } from '@shared/schemas/install-log';

export const iso = (d: Date | null) => (d ? d.toISOString() : null);

export const person = (id: string | null, name: string | null): Person | null =>
  id ? { id, name: name ?? '' } : null;
