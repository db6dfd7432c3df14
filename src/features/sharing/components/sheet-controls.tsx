import { useId } from 'react';
import { Printer } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { SwitchRow } from './switch-row';

export const papers = { letter: 'US Letter', a4: 'A4' } as const;
export type Paper = keyof typeof papers;

export const paperOf = (value: string | null): Paper => (value === 'a4' ? 'a4' : 'letter');

/** The page size the print dialog starts with; the sheet's layout fits either. */
function PageSize({ paper }: { paper: Paper }) {
  return <style>{`@page { size: ${paper === 'a4' ? 'A4' : 'letter'}; margin: 14mm 13mm; }`}</style>;
}

/**
 * Above the sheet on screen, gone on paper: the paper size, the owner's money switch, and the
 * button that opens the browser's print dialog (where "Save as PDF" makes the PDF).
 */
export function SheetControls({
  paper,
  onPaper,
  money,
}: {
  paper: Paper;
  onPaper: (paper: Paper) => void;
  /** Only for the owner: whether the sheet includes money. */
  money?: { on: boolean; onChange: (on: boolean) => void };
}) {
  const paperId = useId();
  return (
    <div className="mb-6 flex flex-col gap-3 rounded-lg border border-rule bg-sheet px-4 py-3 print:hidden">
      <PageSize paper={paper} />
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex flex-col gap-1">
          <label htmlFor={paperId} className="font-semibold">
            Paper
          </label>
          <select
            id={paperId}
            value={paper}
            onChange={(event) => onPaper(paperOf(event.target.value))}
            className="min-h-11 rounded-md border border-rule-strong bg-white px-3 text-ink"
          >
            {Object.entries(papers).map(([value, label]) => (
              <option key={value} value={value}>
                {label}
              </option>
            ))}
          </select>
        </div>
        <Button onClick={() => window.print()} icon={<Printer aria-hidden className="size-4" />}>
          Print or save as PDF
        </Button>
      </div>
      {money && (
        <div className="border-t border-rule pt-3">
          <SwitchRow
            label="Include money"
            description="The budget, what is spent and each part’s total, on your copy only. The public page and sheet never show money."
            checked={money.on}
            onChange={money.onChange}
          />
        </div>
      )}
    </div>
  );
}
