import type { ReactNode } from 'react';
import { fluidTemperatureUnitLabels, type BenchSheet } from '@shared/schemas/bench';
import { formatNumber } from '@shared/format';
import { formatWhen } from '@/lib/dates';

function Fact({
  term,
  children,
  wide = false,
}: {
  term: string;
  children: ReactNode;
  /** Across both columns (a <dl> may hold only one wrapping div per term). */
  wide?: boolean;
}) {
  return (
    <div className={wide ? 'min-w-0 sm:col-span-2' : 'min-w-0'}>
      <dt className="text-xs font-semibold tracking-wide text-muted uppercase">{term}</dt>
      <dd className="break-words text-ink">{children}</dd>
    </div>
  );
}

/** A sheet's particulars: the set, who tested and entered it, the fluid, conditions and notes. */
export function SheetDetails({ sheet }: { sheet: BenchSheet }) {
  return (
    <dl className="grid grid-cols-1 gap-x-6 gap-y-3 text-[15px] sm:grid-cols-2">
      <Fact term="Injector set">{sheet.partName}</Fact>
      <Fact term="Tested by">{sheet.testedBy || '–'}</Fact>
      <Fact term="Test fluid">{sheet.fluid || '–'}</Fact>
      <Fact term="Fluid temperature">
        {sheet.fluidTemperature
          ? `${formatNumber(sheet.fluidTemperature.value, 1)} ${fluidTemperatureUnitLabels[sheet.fluidTemperature.unit]}`
          : '–'}
      </Fact>
      <Fact term="Entered by">
        {sheet.enteredBy ? sheet.enteredBy.name : 'Someone no longer on Headroom'}
        {sheet.shopUserId ? ' (the shop)' : ''} · {formatWhen(sheet.createdAt)}
      </Fact>
      {sheet.updatedAt !== sheet.createdAt && sheet.updatedBy && (
        <Fact term="Last changed">
          {sheet.updatedBy.name} · {formatWhen(sheet.updatedAt)}
        </Fact>
      )}
      {sheet.points.some((p) => p.condition) && (
        <Fact term="Test conditions">
          <ul>
            {sheet.points
              .filter((p) => p.condition)
              .map((p) => (
                <li key={p.label}>
                  {p.label}: {p.condition}
                </li>
              ))}
          </ul>
        </Fact>
      )}
      {sheet.notes && (
        <Fact term="Notes" wide>
          <span className="whitespace-pre-line">{sheet.notes}</span>
        </Fact>
      )}
    </dl>
  );
}
