/**
 * Typed calls to the sites API. Sites hold the client's private details, so they only
 * ever travel to signed-in members of the organisation.
 */
import { json, request } from './http.js';
import { createdSchema } from '../../shared/schemas/boards.js';
import { siteDetailSchema, siteListResponseSchema, type SiteInput } from '../../shared/schemas/site.js';

export type { Site, SiteDetail, SiteInput } from '../../shared/schemas/site.js';

export const listSites = (q?: string) => json(siteListResponseSchema, 'GET', `/api/sites${q ? `?q=${encodeURIComponent(q)}` : ''}`);
export const getSite = (id: number) => json(siteDetailSchema, 'GET', `/api/sites/${id}`);
export const createSite = (body: SiteInput) => json(createdSchema, 'POST', '/api/sites', { body });
export const updateSite = (id: number, body: SiteInput) => request('PUT', `/api/sites/${id}`, { body }).then(() => undefined);
export const deleteSite = (id: number) => request('DELETE', `/api/sites/${id}`).then(() => undefined);
