/** Use-cases on sites: the organisation's private record of where its boards are and whose they are. */
import { isStillReferenced } from '../db/errors.js';
import type { Db } from '../db/client.js';
import type { Site, SiteDetail, SiteInput, SiteUpdate } from '../../shared/schemas/site.js';
import { conflict, notFound, stale } from '../errors.js';
import { inTransaction } from '../db/client.js';
import { deleteSiteRow, detachDeletedBoards, findSite, insertSite, listSites, updateSiteIfAt } from './repository.js';
import { listSiteBoards } from '../boards/repository.js';

export async function listOrganisationSites(db: Db, organisationId: number, q?: string): Promise<{ items: Site[] }> {
  return { items: await listSites(db, organisationId, q) };
}

export async function getSite(db: Db, organisationId: number, id: number): Promise<SiteDetail> {
  const site = await findSite(db, organisationId, id);
  if (!site) throw notFound('No such site');
  return { ...site, boards: await listSiteBoards(db, organisationId, id) };
}

export function createSite(db: Db, organisationId: number, input: SiteInput): Promise<number> {
  return insertSite(db, organisationId, input);
}

/** Replaces the site's fields if nobody saved it since `baseRevision` (else 409 `stale` with the current revision). */
export async function replaceSite(db: Db, organisationId: number, id: number, update: SiteUpdate): Promise<Site> {
  const { baseRevision, ...input } = update;
  const won = await updateSiteIfAt(db, organisationId, id, baseRevision, input);
  const site = await findSite(db, organisationId, id);
  if (!site) throw notFound('No such site');
  if (!won) throw stale('site', site.revision);
  return site;
}

/** A site with boards in use is kept (move or delete the boards first), so no board loses its site silently. */
export async function deleteSite(db: Db, organisationId: number, id: number): Promise<void> {
  const site = await findSite(db, organisationId, id);
  if (!site) throw notFound('No such site');
  if (site.boardCount > 0) throw conflict(`This site still has ${site.boardCount} board(s): move or delete them first`);
  try {
    await inTransaction(db, async (tx) => {
      await detachDeletedBoards(tx, organisationId, id);
      await deleteSiteRow(tx, organisationId, id);
    });
  } catch (err) {
    // A board put on the site since the count above: the foreign key keeps the site, and so do we.
    if (isStillReferenced(err)) throw conflict('This site has boards: move or delete them first');
    throw err;
  }
}
