/**
 * Organisation settings. The organisation is always the signed-in member's own: its id comes
 * from the session, never from the request, so there is no other organisation to reach.
 */
import type { Db } from '../db/client.js';
import type { Organisation, OrganisationSave } from '../../shared/schemas/organisation.js';
import { notFound, stale } from '../errors.js';
import { findOrganisation, updateOrganisationIfAt } from './repository.js';

export async function organisationOf(db: Db, organisationId: number): Promise<Organisation> {
  const organisation = await findOrganisation(db, organisationId);
  if (!organisation) throw notFound('No such organisation');
  return organisation;
}

/**
 * Saves the settings if nobody wrote the organisation since `baseRevision` (else 409 `stale` with the
 * current revision); print offsets left out keep their current values. Returns the saved settings.
 */
export async function saveOrganisation(db: Db, organisationId: number, save: OrganisationSave): Promise<Organisation> {
  const { baseRevision, ...settings } = save;
  const won = await updateOrganisationIfAt(db, organisationId, baseRevision, settings);
  const organisation = await organisationOf(db, organisationId);
  if (!won) throw stale('organisation', organisation.revision);
  return organisation;
}
