import type { Role } from '@wickstone/contracts';
import type { User } from '../db/models/index.js';

/** Who is calling, set by the session middleware from a valid session cookie. */
export interface SessionState {
  user: User;
  /** The session's id: the same across renewals, revoked on sign-out. */
  sid: string;
  /** Unix seconds of the sign-in that started the session. */
  authTime: number;
}

/** The caller's membership in the organisation named by `:orgId`, set by `orgScope`. */
export interface OrgScope {
  id: number;
  name: string;
  slug: string;
  role: Role;
}

/** What the audit log and services need to know about a request, free of Express. */
export interface RequestMeta {
  ip: string | null;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      session?: SessionState;
      /** Why a session cookie that was sent is not in use (tampered, expired, revoked...). */
      sessionProblem?: string;
      org?: OrgScope;
    }
  }
}

export function requestMeta(req: { ip?: string | undefined }): RequestMeta {
  return { ip: req.ip ? req.ip.slice(0, 45) : null };
}
