import type { EstimateResult, Figure } from '@shared/schemas/estimate';
import { formatFigure } from '../format';
import { Working } from './working';

type Row = {
  term: string;
  main: Figure;
  also?: Figure[];
  /** A related figure with its own words, on a line of its own. */
  aside?: { text: string; figure: Figure };
};

/** What the target asks of the engine: power, torque, fuel, injector delivery and air. */
export function Requirements({ result }: { result: EstimateResult }) {
  const r = result.requirements;
  const rows: Row[] = [
    { term: 'Crank power', main: r.crankPower, also: [r.crankPowerKw] },
    { term: 'Wheel power', main: r.wheelPower },
    result.target.torqueLbft != null
      ? {
          term: 'Crank torque (your target or peak power’s, the larger)',
          main: r.crankTorque,
          also: [r.crankTorqueNm],
          aside: { text: 'At peak power', figure: r.crankTorqueAtPeakPower },
        }
      : { term: 'Crank torque at peak power', main: r.crankTorque, also: [r.crankTorqueNm] },
    { term: 'Fuel burned', main: r.fuelMassFlow },
    { term: 'Fuel volume', main: r.fuelVolumeFlow, also: [r.fuelVolumeFlowGalPerH] },
    { term: 'Delivery per injector per stroke', main: r.injectorDelivery },
    { term: 'Turbocharger air flow', main: r.airMassFlow },
    { term: 'Excess-air ratio', main: r.lambda },
  ];
  return (
    <dl className="grid gap-x-6 sm:grid-cols-2">
      {rows.map((row) => (
        <div
          key={row.term}
          className="border-b border-rule py-2 last:border-b-0 sm:[&:nth-last-child(2)]:border-b-0"
        >
          <dt className="text-sm font-semibold tracking-wide text-muted uppercase">{row.term}</dt>
          <dd>
            <span className="text-lg font-bold tabular-nums text-ink">
              {formatFigure(row.main.value, row.main.unit)}
            </span>
            {row.also?.map((f) => (
              <span key={f.unit} className="ml-2 text-ink-2 tabular-nums">
                {formatFigure(f.value, f.unit)}
              </span>
            ))}
            {row.aside && (
              <span className="block text-ink-2 tabular-nums">
                {row.aside.text}: {formatFigure(row.aside.figure.value, row.aside.figure.unit)}
              </span>
            )}
            <Working
              figures={[row.main, ...(row.also ?? []), ...(row.aside ? [row.aside.figure] : [])]}
              label={row.term}
            />
          </dd>
        </div>
      ))}
    </dl>
  );
}
