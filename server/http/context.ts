/** What a request carries once the session is read: the signed-in member, if any. */
import type { Role } from '../../shared/schemas/auth.js';

export interface CurrentUser {
  id: number;
  email: string;
  name: string;
  role: Role;
  organisationId: number;
  organisationName: string;
}

declare module 'express-session' {
  interface SessionData {
    userId?: number;
  }
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      user?: CurrentUser;
    }
  }
}
