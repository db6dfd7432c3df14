/**
 * The install log's notices: "step signed off" and "torque reading out of spec".
 * The single place this feature calls notify() from server/features/notices,
 * inside the transaction of the change, so a notice is queued exactly when the
 * sign-off or reading is committed. Shops hear only when the step is linked to
 * parts sent to exactly one shop (that shop is named); no money is ever in a notice.
 */
import type { Knex } from 'knex';
import {
  describeTarget,
  formatTorque,
  verdictLabels,
  type TorqueTarget,
  type TorqueUnit,
  type Verdict,
} from '@shared/install-log/torque';
import { quoted } from '@server/features/mail';
import { actorName, notify } from '@server/features/notices';
import { shopsOfStep } from './step-parts.repository';
import { paths } from '@shared/paths';

/** The one shop whose parts the step fits, if exactly one. */
async function stepShop(trx: Knex, stepId: string): Promise<string | null> {
  const shops = await shopsOfStep(trx, stepId);
  return shops.length === 1 ? shops[0] : null;
}

export async function notifyStepSignedOff(
  trx: Knex,
  n: {
    buildId: string;
    stepId: string;
    stepTitle: string;
    jobTitle: string;
    overrideReason: string | null;
    actorUserId: string;
  },
) {
  const who = await actorName(trx, n.actorUserId);
  const over = n.overrideReason
    ? `\n\nSigned off over open items, with this reason: ${quoted(n.overrideReason)}`
    : '';
  await notify(
    trx,
    n.buildId,
    'step-signed-off',
    {
      subject: `Step signed off: ${n.stepTitle}`,
      text: `${who} signed off ${quoted(n.stepTitle)} in the job ${quoted(n.jobTitle)}.${over}`,
      link: paths.builds.step.getHref(n.buildId, n.stepId),
      linkLabel: 'Open the step',
    },
    { actorUserId: n.actorUserId, shopUserId: await stepShop(trx, n.stepId) },
  );
}

export async function notifyTorqueOutOfSpec(
  trx: Knex,
  n: {
    buildId: string;
    stepId: string;
    stepTitle: string;
    specName: string;
    spec: TorqueTarget;
    /** "#3", or the position's name ("Cyl 3") when the spec names them. */
    positionLabel: string;
    verdict: Exclude<Verdict, 'in-spec'>;
    value: number;
    unit: TorqueUnit;
    retorque: boolean;
    actorUserId: string;
  },
) {
  const who = await actorName(trx, n.actorUserId);
  const what = n.retorque ? 're-torque check' : 'reading';
  await notify(
    trx,
    n.buildId,
    'torque-out-of-spec',
    {
      subject: `${verdictLabels[n.verdict]}: ${n.specName} ${n.positionLabel}`,
      text:
        `${who} recorded a ${what} of ${formatTorque(n.value, n.unit)} on ${n.specName} ${n.positionLabel} ` +
        `in ${quoted(n.stepTitle)}. The spec is ${describeTarget(n.spec)}.\n\n` +
        (n.retorque
          ? 'The re-torque check stays open until the position reads in spec.'
          : 'The step cannot be signed off until the position reads in spec, unless the owner overrides with a reason.'),
      link: paths.builds.step.getHref(n.buildId, n.stepId),
      linkLabel: 'Open the step',
    },
    { actorUserId: n.actorUserId, shopUserId: await stepShop(trx, n.stepId) },
  );
}
