// PUT /api/packages/:id/draft: autosave of a draft. `baseUpdatedAt` is the revision's
// updatedAt this tab last saw; the server answers 409 stale_draft when another tab saved
// since, and 409 already_submitted once the revision is frozen.
import { PackageDetail, type SaveDraftBody } from '@shared/schemas/packages';
import { api, CSRF_HEADER } from '@/lib/api-client';

export function saveDraft(id: string, body: SaveDraftBody): Promise<PackageDetail> {
  return api.put(`/api/packages/${encodeURIComponent(id)}/draft`, body, PackageDetail);
}

/** A last save when the page is being hidden or closed: fire and forget, survives unload. */
export function saveDraftOnExit(id: string, body: SaveDraftBody): void {
  try {
    void fetch(`/api/packages/${encodeURIComponent(id)}/draft`, {
      method: 'PUT',
      headers: { 'Content-Type': 'application/json', Accept: 'application/json', ...CSRF_HEADER },
      body: JSON.stringify(body),
      credentials: 'include',
      keepalive: true,
    }).catch(() => undefined);
  } catch {
    // Nothing more can be done while the page goes away; the last autosave stands.
  }
}
