/**
 * Sharing: a build's public page (an unguessable address the owner switches on
 * and off) and the printable build sheet. Both are drawn from one view of the
 * build, `BuildView`, which the server composes from what the owner chose to
 * show. The public view never carries money, vendors, notes, e-mail addresses,
 * private photos, or members' names unless the owner chose to show names.
 */
import { z } from 'zod';
import type { aspirations, powerBases } from '@shared/builds/vocabulary';
import type { PartCategory, PartStatus, RatingUnit } from './parts';
import type { Role } from '@shared/permissions';
import { idSchema } from './common';

type PowerBasis = (typeof powerBases)[number];

export {
  defaultShareSections,
  shareSectionHints,
  shareSectionLabels,
  shareSections,
  type ShareSection,
  type ShareSections,
} from '@shared/sharing/vocabulary';
import {
  shareSectionLabels,
  shareSections,
  type ShareSection,
  type ShareSections,
} from '@shared/sharing/vocabulary';

const flag = (what: string) => z.boolean({ message: `${what}: choose on or off` });

export const shareSectionsInputSchema = z
  .object(
    Object.fromEntries(shareSections.map((s) => [s, flag(shareSectionLabels[s]).optional()])) as {
      [K in ShareSection]: z.ZodOptional<z.ZodBoolean>;
    },
  )
  .strict();

/** PUT /api/builds/:buildId/share: any of these; the share is made on first use. */
export const updateShareInputSchema = z
  .object({
    enabled: flag('Public page').optional(),
    sections: shareSectionsInputSchema.optional(),
    showMemberNames: flag('Show names').optional(),
    allowIndexing: flag('Search engines').optional(),
    coverPhotoId: idSchema.nullable().optional(),
  })
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateShareInput = z.infer<typeof updateShareInputSchema>;

/** POST /api/builds/:buildId/share/regenerate takes no fields. */
export const regenerateShareInputSchema = z.object({}).strict();

/** PUT /api/builds/:buildId/share/photos/:photoId */
export const photoVisibilityInputSchema = z
  .object({ public: z.boolean({ message: 'Choose public or private' }) })
  .strict();
export type PhotoVisibilityInput = z.infer<typeof photoVisibilityInputSchema>;

/** GET /api/builds/:buildId/sheet?money=1: money only on the owner's sheet, and only when asked. */
export const sheetQuerySchema = z
  .object({ money: z.enum(['0', '1'], { message: 'money is 0 or 1' }).optional() })
  .strict();

/** 32 random bytes in base64url: the shape of a share token (256 bits). */
export const shareTokenPattern = /^[A-Za-z0-9_-]{43}$/;

/** The owner's settings, as GET and PUT /api/builds/:buildId/share answer them. */
export type ShareSettings = {
  enabled: boolean;
  /** Null until sharing is first switched on. */
  token: string | null;
  /** The public page's full address (APP_URL + /shared/<token>), or null. */
  url: string | null;
  sections: ShareSections;
  showMemberNames: boolean;
  allowIndexing: boolean;
  /** The photo link previews show; only a public photo of the build. */
  coverPhotoId: string | null;
  publicPhotoIds: string[];
};

// ---------------------------------------------------------------- the view

export type ViewPart = {
  name: string;
  quantity: number;
  status: PartStatus;
  statusLabel: string;
  rating: { value: number; unit: RatingUnit; unitLabel: string; for: string } | null;
  /** The estimate's headroom of a rated part against the target. */
  headroom: { pct: number; status: 'over' | 'tight' | 'ok' } | null;
  /** Member sheet only. */
  vendor?: string;
  partNumber?: string;
  /** Only with names shown: the shop member the part is at. */
  shopName?: string | null;
  /** The owner's sheet with money only. */
  totalCents?: number;
};

export type ViewFastener = {
  name: string;
  count: number;
  target: { value: number; unit: string };
  /** "± 5 %" or "± 2 lbf·ft". */
  tolerance: string;
  threadCondition: string;
  finalAngleDeg: number | null;
  /** Member sheet only: where the spec came from. */
  specSource?: string;
  recorded: number;
  inSpec: number;
  outOfSpec: number;
  /** Positions whose current reading is out of spec. */
  outOfSpecPositions: number[];
  retorque: { asked: boolean; description: string | null; closed: boolean };
};

export type ViewStep = {
  title: string;
  status: 'not-started' | 'under-way' | 'signed-off';
  checklist: { done: number; total: number };
  signOff: { on: string; by: string | null; override: boolean } | null;
  fasteners: ViewFastener[];
};

export type ViewJob = { title: string; steps: ViewStep[] };

export type ViewDynoBest = {
  basis: PowerBasis;
  peakPower: number | null;
  powerUnit: string;
  peakPowerRpm: number | null;
  peakTorque: number | null;
  torqueUnit: string;
  peakTorqueRpm: number | null;
};

export type ViewPhoto = {
  id: string;
  caption: string;
  width: number;
  height: number;
  webUrl: string;
  thumbUrl: string;
};

/** One build as the public page and the build sheet show it; a section the owner hid is null. */
export type BuildView = {
  kind: 'public' | 'member';
  name: string;
  summary: {
    vehicleYear: number | null;
    vehicleDescription: string;
    engineDescription: string;
    displacementLiters: number | null;
    cylinders: number;
    aspiration: (typeof aspirations)[number];
    transmission: string;
    stockPowerHp: number | null;
    stockPowerBasis: PowerBasis;
    targetPowerHp: number;
    targetPowerBasis: PowerBasis;
    targetTorqueLbft: number | null;
    targetDate: string | null;
    targetEvent: string;
  } | null;
  parts: {
    total: number;
    byStatus: Partial<Record<PartStatus, number>>;
    categories: { category: PartCategory; label: string; parts: ViewPart[] }[];
  } | null;
  estimate: {
    weakestLink: {
      name: string;
      category: PartCategory;
      categoryLabel: string;
      headroomPct: number;
      status: 'over' | 'tight' | 'ok';
      message: string;
    } | null;
    supported: { crankHp: number; wheelHp: number } | null;
    warnings: { severity: 'danger' | 'warning' | 'info'; message: string }[];
    ratedParts: number;
  } | null;
  install: {
    jobs: ViewJob[];
    totals: {
      steps: number;
      signedOff: number;
      underWay: number;
      fasteners: number;
      positionsTotal: number;
      positionsRecorded: number;
      inSpec: number;
      outOfSpec: number;
    };
  } | null;
  bench: {
    sheets: {
      partName: string;
      occasion: string;
      testedOn: string;
      status: string;
      verdict: string;
    }[];
  } | null;
  dyno: {
    /** The correction every figure is read under. */
    standard: string;
    best: (ViewDynoBest & { date: string; peakPowerHp: number }) | null;
    vsTarget: {
      progressPct: number;
      reached: boolean;
      achievedHp: number;
      basis: PowerBasis;
    } | null;
    sessions: {
      date: string;
      dynoKind: 'chassis' | 'engine';
      runCount: number;
      best: ViewDynoBest | null;
    }[];
  } | null;
  photos: ViewPhoto[] | null;
  /** The link-preview photo, when photos are shown. */
  cover: ViewPhoto | null;
  /** Only when names are shown. */
  crew: { name: string; role: Role }[] | null;
  /** The owner's sheet with money switched on only. */
  money: {
    currency: string;
    budgetCents: number;
    plannedCents: number;
    committedCents: number;
    spentCents: number;
  } | null;
};
