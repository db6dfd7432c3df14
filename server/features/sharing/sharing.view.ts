/**
 * One build as the public page and the build sheet show it (BuildView), built
 * from the other features' own reads as an owner of the build would see them,
 * then narrowed to a whitelist: every field below is copied by name, so a field
 * a feature adds later never reaches a visitor by accident. The public view
 * then goes through `scrubPublic` as a second wall: no `…Cents` key and no
 * e-mail address survives it, whatever a field holds.
 */
import type { Knex } from 'knex';
import { computeBudget } from '@shared/ledger/budget';
import { partTotalCents } from '@shared/ledger/cost';
import {
  partCategories,
  partCategoryLabels,
  partStatusLabels,
  ratingUnitLabels,
  type PartCategory,
} from '@shared/schemas/parts';
import type { BuildView, ShareSections, ViewPart, ViewPhoto } from '@shared/schemas/sharing';
import { AppError, NotFoundError } from '@server/lib/errors';
import { stripMoney } from '@server/lib/money-filter';
import type { BuildScope } from '@server/lib/scope';
import * as bench from '@server/features/bench';
import * as builds from '@server/features/builds';
import * as estimate from '@server/features/estimate';
import * as installLog from '@server/features/install-log';
import * as members from '@server/features/members';
import * as parts from '@server/features/parts';
import * as photos from '@server/features/photos';
import { viewDyno, viewInstall } from './sharing.view-sections';

export type ViewOptions = {
  kind: 'public' | 'member';
  sections: ShareSections;
  /** Members' names (sign-offs, the crew list, a part's shop). */
  showNames: boolean;
  /** The owner's sheet with money switched on. */
  money: boolean;
  coverPhotoId: string | null;
  /** Where a public photo's bytes are served (public view only). */
  photoUrl?: (photoId: string, size: 'web' | 'thumb') => string;
};

type PartRecord = Awaited<ReturnType<typeof parts.listAll>>[number];
type Estimate = Awaited<ReturnType<typeof estimate.estimateBuild>>;

function viewParts(all: PartRecord[], est: Estimate | null, opts: ViewOptions) {
  // A part sent back is not part of the build any more; the member sheet lists it as returned.
  const list = opts.kind === 'public' ? all.filter((p) => p.status !== 'returned') : all;
  const headroom = new Map(
    (est?.components ?? []).map((c) => [
      c.id,
      { pct: Math.round(c.headroomPct.value * 10) / 10, status: c.status },
    ]),
  );
  const byStatus: Partial<Record<PartRecord['status'], number>> = {};
  for (const p of list) byStatus[p.status] = (byStatus[p.status] ?? 0) + 1;
  const present = (p: PartRecord): ViewPart => ({
    name: p.name,
    quantity: p.quantity,
    status: p.status,
    statusLabel: partStatusLabels[p.status],
    rating:
      p.ratingValue !== null && p.ratingUnit !== null
        ? {
            value: p.ratingValue,
            unit: p.ratingUnit,
            unitLabel: ratingUnitLabels[p.ratingUnit],
            for: p.ratingFor,
          }
        : null,
    headroom: headroom.get(p.id) ?? null,
    ...(opts.kind === 'member' ? { vendor: p.vendor, partNumber: p.partNumber } : {}),
    ...(opts.showNames ? { shopName: p.shopName } : {}),
    ...(opts.money ? { totalCents: partTotalCents(p) } : {}),
  });
  const categories = partCategories
    .map((category: PartCategory) => ({
      category,
      label: partCategoryLabels[category],
      parts: list.filter((p) => p.category === category).map(present),
    }))
    .filter((c) => c.parts.length > 0);
  return { total: list.length, byStatus, categories };
}

function viewEstimate(est: Estimate) {
  return {
    weakestLink: est.weakestLink
      ? {
          name: est.weakestLink.name,
          category: est.weakestLink.category,
          categoryLabel: partCategoryLabels[est.weakestLink.category],
          headroomPct: Math.round(est.weakestLink.headroomPct * 10) / 10,
          status: est.weakestLink.status,
          message: est.weakestLink.message,
        }
      : null,
    supported: est.supported
      ? {
          crankHp: Math.round(est.supported.crankPower.value),
          wheelHp: Math.round(est.supported.wheelPower.value),
        }
      : null,
    warnings: est.warnings.map((w) => ({ severity: w.severity, message: w.message })),
    ratedParts: est.components.length,
  };
}

/** The estimate, or null where none can be made (a build stored without a target). */
async function estimateOrNull(knex: Knex, buildId: string): Promise<Estimate | null> {
  try {
    return await estimate.estimateBuild(knex, buildId);
  } catch (err) {
    if (err instanceof AppError && err.status === 409) return null;
    throw err;
  }
}

/** The view of one build under `opts`. */
export async function composeView(
  knex: Knex,
  buildId: string,
  opts: ViewOptions,
): Promise<BuildView> {
  // The features read as an owner would; what leaves is decided below, field by field.
  const ownerId = await members.anOwnerId(knex, buildId);
  if (!ownerId) throw new NotFoundError('Build not found');
  const scope: BuildScope = { knex, buildId, caller: { userId: ownerId, role: 'owner' } };
  const on = opts.sections;
  const build = await builds.get(knex, buildId, ownerId);
  const [partList, est, install, sheets, dynoView, photoList, crew] = await Promise.all([
    on.parts || opts.money ? parts.listAll(knex, buildId) : null,
    on.parts || on.estimate ? estimateOrNull(knex, buildId) : null,
    on.install ? installLog.installRecord(scope) : null,
    on.bench ? bench.listSheets(knex, buildId, scope.caller, {}) : null,
    on.dyno ? viewDyno(scope) : null,
    on.photos && opts.kind === 'public' ? photos.listPublic(knex, buildId) : null,
    opts.showNames ? members.names(knex, buildId) : null,
  ]);

  const photoView = (photoList ?? []).map((p): ViewPhoto => ({
    id: p.id,
    caption: p.caption,
    width: p.web.width,
    height: p.web.height,
    webUrl: opts.photoUrl!(p.id, 'web'),
    thumbUrl: opts.photoUrl!(p.id, 'thumb'),
  }));
  let money: BuildView['money'] = null;
  if (opts.money && partList) {
    const budget = computeBudget(partList, build.budgetCents ?? 0, build.currency);
    money = {
      currency: build.currency,
      budgetCents: build.budgetCents ?? 0,
      plannedCents: budget.totals.plannedCents,
      committedCents: budget.totals.committedCents,
      spentCents: budget.totals.spentCents,
    };
  }
  const view: BuildView = {
    kind: opts.kind,
    name: build.name,
    summary: on.summary
      ? {
          vehicleYear: build.vehicleYear,
          vehicleDescription: build.vehicleDescription,
          engineDescription: build.engineDescription,
          displacementLiters: build.displacementLiters,
          cylinders: build.cylinders,
          aspiration: build.aspiration,
          transmission: build.transmission,
          stockPowerHp: build.stockPowerHp,
          stockPowerBasis: build.stockPowerBasis,
          targetPowerHp: build.targetPowerHp,
          targetPowerBasis: build.targetPowerBasis,
          targetTorqueLbft: build.targetTorqueLbft,
          targetDate: build.targetDate,
          targetEvent: build.targetEvent,
        }
      : null,
    parts: on.parts && partList ? viewParts(partList, est, opts) : null,
    estimate: on.estimate && est ? viewEstimate(est) : null,
    install: install ? viewInstall(install, opts) : null,
    bench: sheets
      ? {
          sheets: sheets.map((s) => ({
            partName: s.partName,
            occasion: s.occasion,
            testedOn: s.testedOn,
            status: s.status,
            verdict: s.verdict,
          })),
        }
      : null,
    dyno: dynoView,
    photos: photoList ? photoView : null,
    cover: photoList
      ? (photoView.find((p) => p.id === opts.coverPhotoId) ?? photoView[0] ?? null)
      : null,
    crew,
    money,
  };
  return opts.kind === 'public' ? scrubPublic(view) : view;
}

const emailPattern = /[^\s@<>()[\],;:"]+@[^\s@<>()[\],;:"]+\.[A-Za-z]{2,}/g;

/**
 * The last wall before a visitor: every `…Cents` key goes (at any depth), and an e-mail
 * address typed into a part name, a title or a caption is masked.
 */
export function scrubPublic<T>(view: T): T {
  const mask = (v: unknown): unknown => {
    if (typeof v === 'string') return v.replace(emailPattern, '(e-mail hidden)');
    if (Array.isArray(v)) return v.map(mask);
    if (v && typeof v === 'object') {
      return Object.fromEntries(Object.entries(v).map(([k, x]) => [k, mask(x)]));
    }
    return v;
  };
  return mask(stripMoney(view)) as T;
}
