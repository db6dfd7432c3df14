import { ShieldAlert } from 'lucide-react';

/**
 * The usual cautions of a dyno day, in general words (product.md, "Cautions shown in the
 * product"): the dyno operator's procedures come first.
 */
export function DynoCautions() {
  return (
    <aside
      aria-label="Dyno safety"
      className="flex gap-2.5 rounded-md border border-rule-strong bg-sheet px-3.5 py-3 text-[15px] text-ink-2"
    >
      <ShieldAlert aria-hidden className="mt-0.5 size-5 shrink-0 text-ink-3" />
      <div className="flex flex-col gap-1.5">
        <p>
          <strong className="text-ink">The dyno operator’s procedures come first.</strong> Headroom
          records pulls and corrects them; it does not say how to run a dynamometer.
        </p>
        <ul className="list-disc pl-5">
          <li>
            Strap the truck down as the operator directs and stay clear of the rollers, the straps
            and the line of the wheels during a pull.
          </li>
          <li>
            Keep fire extinguishers at hand and watch for leaks of fuel, oil or coolant; stop the
            pull at the first sign of fire or smoke from under the truck.
          </li>
          <li>Wear hearing protection in the cell; a pull is loud for everyone in it.</li>
          <li>
            Know how the operator stops a runaway diesel (an engine feeding on its own oil) before
            the first pull: shutting off the key may not stop it.
          </li>
        </ul>
      </div>
    </aside>
  );
}
