/**
 * Typed calls to the sites API. Sites hold the client's private details, so they only
 * ever travel to signed-in members of the organisation.
 */
import { json, request } from './http.js';
import { createdSchema } from '../../shared/schemas/boards.js';
import { siteDetailSchema, siteListResponseSchema, siteSchema, type SiteInput, type SiteUpdate } from '../../shared/schemas/site.js';

export type { Site, SiteDetail, SiteInput, SiteUpdate } from '../../shared/schemas/site.js';

export const listSites = (q?: string) => json(siteListResponseSchema, 'GET', `/api/sites${q ? `?q=${encodeURIComponent(q)}` : ''}`);
export const getSite = (id: number) => json(siteDetailSchema, 'GET', `/api/sites/${id}`);
export const createSite = (body: SiteInput) => json(createdSchema, 'POST', '/api/sites', { body });
/** Saves against `body.baseRevision`; a site saved by someone else since answers 409 (`ApiError.code === 'stale'`). */
export const updateSite = (id: number, body: SiteUpdate) => json(siteSchema, 'PUT', `/api/sites/${id}`, { body });
export const deleteSite = (id: number) => request('DELETE', `/api/sites/${id}`).then(() => undefined);
