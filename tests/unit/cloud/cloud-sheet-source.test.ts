// The cloud sheet source's autosave pause: a project joined live saves as soon as the server has
// acknowledged its operations (the badge must not read "Unsaved changes" for a change already
// stored); a project not edited live keeps the longer pause before its REST save.
import { QueryClient } from '@tanstack/react-query';
import { describe, expect, it } from 'vitest';
import type { SyncClient } from '../../../shared/sync';
import { createCloudSheetSource } from '../../../src/cloud/cloudSheetSource';
import { LIVE_AUTOSAVE_DELAY_MS, registerLiveSession } from '../../../src/collab/liveSessions';

const projectId = '3f1c2d4e-5a6b-4c7d-8e9f-0a1b2c3d4e5f';
// only `status` is read to decide whether the session is live
const client = (status: SyncClient['status']) => ({ status }) as unknown as SyncClient;

describe('cloud sheet source autosave pause', () => {
  it('is the REST pause when the project is not open live, and the short one while it is', () => {
    const source = createCloudSheetSource(projectId, new QueryClient());
    const rest = source.autosaveDelayMs;
    expect(rest).toBeGreaterThan(LIVE_AUTOSAVE_DELAY_MS);
    const off = registerLiveSession(projectId, client('live'));
    expect(source.autosaveDelayMs).toBe(LIVE_AUTOSAVE_DELAY_MS);
    off();
    expect(source.autosaveDelayMs).toBe(rest);
  });

  it('falls back to the REST pause once the live session is closed', () => {
    const source = createCloudSheetSource(projectId, new QueryClient());
    const off = registerLiveSession(projectId, client('closed'));
    expect(source.autosaveDelayMs).toBeGreaterThan(LIVE_AUTOSAVE_DELAY_MS);
    off();
  });

  it('is live only for the project that is open live', () => {
    const off = registerLiveSession(projectId, client('live'));
    const other = createCloudSheetSource('9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d', new QueryClient());
    expect(other.autosaveDelayMs).toBeGreaterThan(LIVE_AUTOSAVE_DELAY_MS);
    off();
  });
});
