import type { RequestHandler } from 'express';
import { z } from 'zod';
import { can, type Permission } from '@wickstone/contracts';
import { Membership, Organization } from '../db/models/index.js';
import { AppError, parseRequest } from '../errors.js';

/** 401 unless a valid session came with the request. */
export const requireSignedIn: RequestHandler = (req, _res, next) => {
  if (req.session) return next();
  const why = req.sessionProblem ? ` (${req.sessionProblem})` : '';
  next(new AppError('unauthenticated', `Sign in to continue${why}`));
};

const orgIdSchema = z.object({ orgId: z.coerce.number().int().positive().max(4_294_967_295) });

/**
 * For `/orgs/:orgId/...`: load the caller's membership of that organisation into `req.org`.
 * Not a member, or no such organisation, answers the same 404, so ids of other tenants reveal nothing.
 */
export const orgScope: RequestHandler = async (req, _res, next) => {
  const user = req.session?.user;
  if (!user) return next(new AppError('unauthenticated', 'Sign in to continue'));
  const { orgId } = parseRequest(orgIdSchema, req.params, 'params');
  const membership = await Membership.findOne({
    where: { organizationId: orgId, userId: user.id },
    include: [{ model: Organization, as: 'organization', required: true }],
  });
  if (!membership?.organization) return next(new AppError('not_found', 'Organisation not found'));
  req.org = {
    id: orgId,
    name: membership.organization.name,
    slug: membership.organization.slug,
    role: membership.role,
  };
  next();
};

/** 403 unless the caller's role in `req.org` has the permission (see the table in @wickstone/contracts). */
export function requirePermission(permission: Permission): RequestHandler {
  return (req, _res, next) => {
    if (!req.org) return next(new AppError('internal', 'requirePermission used outside orgScope'));
    if (can(req.org.role, permission)) return next();
    next(
      new AppError('forbidden', `Your role (${req.org.role}) may not do this (${permission})`, {
        permission,
      }),
    );
  };
}
