import { describe, expect, it } from 'vitest';
import { cloudPaths, parseCloudRouteId } from '../../../src/cloud/routeIds';
import { roleAtLeast } from '../../../src/cloud/types';
import { saveErrorMessage } from '../../../src/cloud/cloudSheetSource';
import { ApiError } from '../../../src/lib/api';

const P = '3f2b8c1e-9a4d-4c6b-8e1f-0a2b3c4d5e6f';
const R = 'a1b2c3d4-e5f6-4a7b-8c9d-0e1f2a3b4c5d';

describe('cloud route ids', () => {
  it('recognises a project, a revision and a share link, and nothing else', () => {
    expect(parseCloudRouteId(P)).toEqual({ kind: 'project', projectId: P });
    expect(parseCloudRouteId(`cloud-${P.toUpperCase()}`)).toEqual({ kind: 'project', projectId: P });
    expect(parseCloudRouteId(`rev-${P}_${R}`)).toEqual({ kind: 'revision', projectId: P, revId: R });
    expect(parseCloudRouteId('shared-abcdefghijklmnopqrstuvwxyz012345')).toEqual({ kind: 'shared', token: 'abcdefghijklmnopqrstuvwxyz012345' });
    for (const other of ['local', 'example-battery-divider', 'shared-short', `${P}x`, `rev-${P}`, '']) expect(parseCloudRouteId(other)).toBeNull();
  });

  it('round-trips the paths it builds', () => {
    expect(parseCloudRouteId(cloudPaths.revision(P, R).replace('/sheets/', ''))).toEqual({ kind: 'revision', projectId: P, revId: R });
    expect(cloudPaths.project(P)).toBe(`/projects/${P}`);
  });
});

describe('roles and save messages', () => {
  it('orders roles viewer < editor < owner', () => {
    expect(roleAtLeast('owner', 'editor')).toBe(true);
    expect(roleAtLeast('editor', 'editor')).toBe(true);
    expect(roleAtLeast('viewer', 'editor')).toBe(false);
    expect(roleAtLeast(undefined, 'viewer')).toBe(false);
  });

  it('says what to do about each refused save', () => {
    expect(saveErrorMessage(new ApiError(409, { code: 'version_conflict', message: 'x', currentVersion: 7 }))).toMatch(/now at version 7\). Reload/);
    expect(saveErrorMessage(new ApiError(401, { code: 'signed_out', message: 'x' }))).toMatch(/signed out/);
    expect(saveErrorMessage(new TypeError('Failed to fetch'))).toMatch(/could not be reached/);
  });
});
