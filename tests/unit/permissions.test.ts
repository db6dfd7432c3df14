import { describe, expect, it } from 'vitest';
import { can, canAddPhotosTo, canCaptionPhoto, capabilities, roles } from '@shared/permissions';

// The role table of product.md, "Users and roles (per build)".
describe('can()', () => {
  it('gives the owner everything', () => {
    for (const action of [
      'build:read',
      'build:update',
      'build:delete',
      'members:manage',
      'money:read',
    ] as const) {
      expect(can('owner', action)).toBe(true);
    }
  });

  it('shows money to nobody but the owner', () => {
    expect(roles.filter((r) => can(r, 'money:read'))).toEqual(['owner']);
  });

  it('lets every role read the build and nobody but the owner change members or delete', () => {
    expect(roles.every((r) => can(r, 'build:read'))).toBe(true);
    expect(roles.filter((r) => can(r, 'members:manage'))).toEqual(['owner']);
    expect(roles.filter((r) => can(r, 'build:delete'))).toEqual(['owner']);
  });
});

// The photo rules the photos service enforces (server/features/photos/photos.service.ts) and the
// pages use to show or hide the caption and upload controls.
describe('canCaptionPhoto()', () => {
  const byShop = { uploadedBy: { id: 'shop-1' } };
  const byCrew = { uploadedBy: { id: 'crew-1' } };

  it('lets owner and crew caption any photo, even one whose uploader has left', () => {
    for (const role of ['owner', 'crew'] as const) {
      expect(canCaptionPhoto(role, 'me', byShop)).toBe(true);
      expect(canCaptionPhoto(role, 'me', { uploadedBy: null })).toBe(true);
    }
  });

  it('lets a shop caption only the photos it uploaded', () => {
    expect(canCaptionPhoto('shop', 'shop-1', byShop)).toBe(true);
    expect(canCaptionPhoto('shop', 'shop-1', byCrew)).toBe(false);
    expect(canCaptionPhoto('shop', 'shop-1', { uploadedBy: null })).toBe(false);
  });

  it('never lets a viewer caption, not even a photo under its own id', () => {
    expect(canCaptionPhoto('viewer', 'v-1', { uploadedBy: { id: 'v-1' } })).toBe(false);
  });
});

describe('canAddPhotosTo()', () => {
  it('lets owner and crew add photos to steps and parts', () => {
    for (const role of ['owner', 'crew'] as const) {
      expect(canAddPhotosTo(role, 'step')).toBe(true);
      expect(canAddPhotosTo(role, 'part')).toBe(true);
    }
  });

  it('lets a shop add photos to parts only, and a viewer nowhere', () => {
    expect(canAddPhotosTo('shop', 'part')).toBe(true);
    expect(canAddPhotosTo('shop', 'step')).toBe(false);
    expect(canAddPhotosTo('viewer', 'part')).toBe(false);
    expect(canAddPhotosTo('viewer', 'step')).toBe(false);
  });
});

// product.md's role table: the owner has everything; crew works on the truck; shop and viewer
// change no build, step or timeline settings.
describe('capabilities()', () => {
  it('gives the owner every capability', () => {
    expect(Object.values(capabilities('owner')).every(Boolean)).toBe(true);
  });

  it('lets crew work on steps and update part progress, and nothing of the owner', () => {
    const crew = capabilities('crew');
    expect(crew.canWorkOnSteps).toBe(true);
    expect(crew.canUpdatePartProgress).toBe(true);
    expect(crew.canEditBuild).toBe(false);
    expect(crew.canOverrideSignOff).toBe(false);
    expect(crew.canSeeMoney).toBe(false);
    expect(crew.canEditPartFully).toBe(false);
  });

  it('gives a viewer no capability at all', () => {
    expect(Object.values(capabilities('viewer')).some(Boolean)).toBe(false);
  });

  it('lets a shop only update the progress of parts', () => {
    const granted = Object.entries(capabilities('shop'))
      .filter(([, yes]) => yes)
      .map(([name]) => name);
    expect(granted).toEqual(['canUpdatePartProgress']);
  });
});
