/** Typed calls for the organisation's own settings (name and contact shown on printed charts). */
import { organisationSchema, type Organisation, type OrganisationSettings } from '../../shared/schemas/organisation.js';
import { json } from './http.js';

export async function fetchOrganisation(): Promise<Organisation> {
  return json(organisationSchema, 'GET', '/api/organisation');
}

export async function saveOrganisation(settings: OrganisationSettings): Promise<Organisation> {
  return json(organisationSchema, 'PUT', '/api/organisation', { body: settings });
}
