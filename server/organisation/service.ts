/**
 * Organisation settings. The organisation is always the signed-in member's own: its id comes
 * from the session, never from the request, so there is no other organisation to reach.
 */
import type { Db } from '../db/client.js';
import type { Organisation, OrganisationSettings } from '../../shared/schemas/organisation.js';
import { notFound } from '../errors.js';
import { findOrganisation, updateOrganisation } from './repository.js';

export async function organisationOf(db: Db, organisationId: number): Promise<Organisation> {
  const organisation = await findOrganisation(db, organisationId);
  if (!organisation) throw notFound('No such organisation');
  return organisation;
}

/** Saves the settings; print offsets left out keep their current values. Returns the saved settings. */
export async function saveOrganisation(db: Db, organisationId: number, settings: OrganisationSettings): Promise<Organisation> {
  await updateOrganisation(db, organisationId, settings);
  return organisationOf(db, organisationId);
}
