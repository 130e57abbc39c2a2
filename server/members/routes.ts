/**
 * `/api/members`: every member reads the list; only owners change members and manage invitations.
 * `/api/invitations`: the link side, used before the invitee has an account.
 */
import { Router } from 'express';
import { acceptInvitationSchema, invitationTokenParamSchema, inviteSchema, memberChangeSchema } from '../../shared/schemas/members.js';
import type { AppContext } from '../context.js';
import { ownerOnly, requireUser } from '../auth/guard.js';
import { signIn } from '../auth/sign-in.js';
import { idParam, parse } from '../http/parse.js';
import { perAddress, perAddressAndOrganisation } from '../http/limits.js';
import { acceptInvitation, invitationByToken, inviteMember, pendingInvitations, revokeInvitation } from './invitation-service.js';
import { changeMember, membersOf } from './service.js';

export function membersRoutes(ctx: AppContext): Router {
  const r = Router();

  r.get('/', requireUser, async (req, res) => {
    res.json({ members: await membersOf(ctx.db, req.user!.organisationId) });
  });

  r.get('/invitations', ownerOnly, async (req, res) => {
    res.json({ invitations: await pendingInvitations(ctx.db, req.user!.organisationId) });
  });

  r.post('/invitations', ownerOnly, ...perAddressAndOrganisation(ctx, 'invitations', ctx.config.rateLimits.sendsPerHour, 'invitations'), async (req, res) => {
    const input = parse(inviteSchema, req.body);
    res.status(201).json(await inviteMember(ctx, req.user!, input));
  });

  r.delete('/invitations/:id', ownerOnly, async (req, res) => {
    await revokeInvitation(ctx.db, req.user!.organisationId, idParam(req.params));
    res.status(204).end();
  });

  r.patch('/:id', ownerOnly, async (req, res) => {
    const id = idParam(req.params);
    const change = parse(memberChangeSchema, req.body);
    res.json(await changeMember(ctx.db, req.user!.organisationId, id, change));
  });

  return r;
}

export function invitationRoutes(ctx: AppContext): Router {
  const r = Router();

  r.get('/:token', async (req, res) => {
    const { token } = parse(invitationTokenParamSchema, req.params);
    res.json(await invitationByToken(ctx.db, token));
  });

  r.post('/accept', perAddress(ctx, 'accept-invitation', ctx.config.rateLimits.sendsPerHour, 'attempts to accept an invitation'), async (req, res) => {
    const input = parse(acceptInvitationSchema, req.body);
    const userId = await acceptInvitation(ctx.db, input);
    await signIn(req, userId);
    res.status(201).json({ id: userId });
  });

  return r;
}
