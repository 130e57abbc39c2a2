/** Typed calls for the organisation's own settings (name and contact shown on printed charts). */
import { organisationSchema, type Organisation, type OrganisationSave } from '../../shared/schemas/organisation.js';
import { json } from './http.js';

export async function fetchOrganisation(): Promise<Organisation> {
  return json(organisationSchema, 'GET', '/api/organisation');
}

/** Saves against `save.baseRevision`; settings saved by someone else since answer 409 (`ApiError.code === 'stale'`). */
export async function saveOrganisation(save: OrganisationSave): Promise<Organisation> {
  return json(organisationSchema, 'PUT', '/api/organisation', { body: save });
}
